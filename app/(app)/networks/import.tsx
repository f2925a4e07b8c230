import { ImportScreen } from '@/components/networks/import-screen';

export default ImportScreen;
