import { OverviewScreen } from '@/components/overview/overview-screen';

export default OverviewScreen;
