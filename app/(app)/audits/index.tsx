import { AuditListScreen } from '@/components/audits/audit-list-screen';

export default AuditListScreen;
