import { HelpScreen } from '@/components/help/help-screen';

export default HelpScreen;
