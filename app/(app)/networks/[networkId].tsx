import { NetworkDetailScreen } from '@/components/networks/network-detail-screen';

export default NetworkDetailScreen;
