import { InvitationScreen } from '@/components/auth/invitation-screen';

export default InvitationScreen;
