import { EdgeDetailScreen } from '@/components/audits/edge-detail-screen';

export default EdgeDetailScreen;
