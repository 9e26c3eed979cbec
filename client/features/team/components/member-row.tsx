import { useState } from 'react';
import { roleLabels, roles, type Role } from '@contracts/auth';
import type { TeamMember } from '@contracts/users';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Td } from '../../../components/ui/table';
import type { MemberUpdate } from '../api/team-queries';

/** Lender clients belong to a lender; every other role to the firm (the server checks the same). */
export function rolesFor(kind: TeamMember['organisationKind']): Role[] {
  return roles.filter((role) => (kind === 'lender' ? role === 'client' : role !== 'client'));
}

interface MemberRowProps {
  member: TeamMember;
  isSelf: boolean;
  busy: boolean;
  onChange: (change: MemberUpdate) => void;
}

export function MemberRow({ member, isSelf, busy, onChange }: MemberRowProps) {
  const [confirmingDeactivation, setConfirmingDeactivation] = useState(false);
  const choices = rolesFor(member.organisationKind);
  const roleLocked = isSelf || choices.length < 2 || !member.active;

  return (
    <tr className={member.active ? 'hover:bg-paper' : 'bg-paper-sunk/40'}>
      <Td>
        <p className={`font-semibold ${member.active ? 'text-ink' : 'text-ink-faint'}`}>
          {member.name}
          {isSelf && <span className="ml-2 text-xs font-medium text-ink-faint">(you)</span>}
        </p>
        <p className="text-[0.8125rem] text-ink-soft">{member.email}</p>
      </Td>
      <Td>
        {roleLocked ? (
          <span className="text-ink-soft">{roleLabels[member.role]}</span>
        ) : (
          <select
            aria-label={`Role of ${member.name}`}
            value={member.role}
            disabled={busy}
            onChange={(event) => onChange({ version: member.version, role: event.target.value as Role })}
            className="h-8 rounded-md border border-rule-strong bg-paper-raised pl-2.5 pr-8 text-sm text-ink focus:border-ink focus:outline-none"
          >
            {choices.map((role) => (
              <option key={role} value={role}>
                {roleLabels[role]}
              </option>
            ))}
          </select>
        )}
      </Td>
      <Td>{member.active ? <Badge tone="positive">Active</Badge> : <Badge tone="muted">Deactivated</Badge>}</Td>
      <Td className="text-right whitespace-nowrap">
        {isSelf ? null : !member.active ? (
          <Button size="sm" busy={busy} busyLabel="Reactivating…" onClick={() => onChange({ version: member.version, active: true })}>
            Reactivate
          </Button>
        ) : confirmingDeactivation ? (
          <span className="inline-flex items-center gap-2">
            <Button
              size="sm"
              variant="danger"
              busy={busy}
              busyLabel="Deactivating…"
              onClick={() => {
                setConfirmingDeactivation(false);
                onChange({ version: member.version, active: false });
              }}
            >
              Deactivate {member.name.split(' ')[0]}
            </Button>
            <Button size="sm" variant="quiet" onClick={() => setConfirmingDeactivation(false)}>
              Keep
            </Button>
          </span>
        ) : (
          <Button size="sm" variant="quiet" className="text-sm font-medium" disabled={busy} onClick={() => setConfirmingDeactivation(true)}>
            Deactivate
          </Button>
        )}
      </Td>
    </tr>
  );
}
