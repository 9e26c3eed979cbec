import { PageHeader } from '../../components/ui/page-header';
import { RoleGate } from '../../features/auth/components/role-gate';
import { OutboxList } from '../../features/outbox/components/outbox-list';

export function OutboxPage() {
  return (
    <RoleGate roles={['admin']}>
      <title>Outbox · Compline</title>
      <div className="flex flex-col gap-6">
        <PageHeader
          eyebrow="Office records"
          title="Outbox"
          description="Every e-mail Compline has sent or is still trying to send. A failed message is retried with growing pauses."
        />
        <OutboxList />
      </div>
    </RoleGate>
  );
}
