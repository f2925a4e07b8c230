import { StartAuditScreen } from '@/components/audits/start-audit-screen';

export default StartAuditScreen;
