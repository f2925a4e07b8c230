import { NetworkListScreen } from '@/components/networks/network-list-screen';

export default NetworkListScreen;
