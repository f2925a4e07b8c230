import { AccountScreen } from '@/components/account/account-screen';

export default AccountScreen;
