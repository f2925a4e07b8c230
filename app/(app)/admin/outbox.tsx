import { OutboxScreen } from '@/components/admin/outbox-screen';

export default OutboxScreen;
