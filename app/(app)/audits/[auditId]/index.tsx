import { AuditScreen } from '@/components/audits/audit-screen';

export default AuditScreen;
