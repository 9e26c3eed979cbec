import { PageHeader } from '../../components/ui/page-header';
import { RoleGate } from '../../features/auth/components/role-gate';
import { AuditTrailTable } from '../../features/outbox/components/audit-trail-table';

export function AuditTrailPage() {
  return (
    <RoleGate roles={['admin']}>
      <title>Audit trail · Compline</title>
      <div className="flex flex-col gap-6">
        <PageHeader eyebrow="Office records" title="Audit trail" description="Who did what, and when: sign-ins and every change to accounts and records. Entries are never edited." />
        <AuditTrailTable />
      </div>
    </RoleGate>
  );
}
