import type { AuditEvent } from '../api/get-audit.api';

const dateFormat = new Intl.DateTimeFormat(undefined, {
  year: 'numeric',
  month: 'short',
  day: '2-digit',
  hour: '2-digit',
  minute: '2-digit',
  second: '2-digit',
});

// Plain words for the actions recorded by accounts, the team, schemes, plans and design
// runs; others show their name.
export const AUDIT_ACTION_LABELS: Record<string, string> = {
  'session.signed_in': 'Signed in',
  'session.sign_in_failed': 'Sign-in failed',
  'team.role_changed': 'Role changed',
  'team.member_removed': 'Removed from the firm',
  'invitation.sent': 'Invitation sent',
  'invitation.resent': 'Invitation sent again',
  'invitation.accepted': 'Invitation accepted',
  'invitation.revoked': 'Invitation withdrawn',
  'password.reset_requested': 'Password link asked for',
  'password.reset': 'Password changed by link',
  'scheme.created': 'Scheme created',
  'scheme.imported': 'Scheme imported from a plan file',
  'scheme.cloned': 'Scheme cloned',
  'scheme.renamed': 'Scheme renamed',
  'scheme.archived': 'Scheme archived',
  'scheme.unarchived': 'Scheme taken out of the archive',
  'scheme.deleted': 'Scheme deleted',
  'scheme.status_changed': 'Scheme status changed',
  'scheme.commented': 'Comment on a scheme',
  'plan.revised': 'Plan saved',
  'plan.restored': 'Plan revision restored',
  'design.run': 'Design run',
  'prices.changed': 'Unit prices changed',
};

function describeDetail(event: AuditEvent): string {
  const d = event.detail;
  if (!d) return '';
  if (event.action === 'team.role_changed') return `${String(d.from)} → ${String(d.to)}`;
  if (event.action === 'scheme.status_changed') return `${String(d.from).replace('_', ' ')} → ${String(d.to).replace('_', ' ')}`;
  if (typeof d.role === 'string') return `role: ${d.role}`;
  return Object.entries(d)
    .filter(([k]) => !/Id$|^replaces$/.test(k))
    .map(([k, v]) => `${k}: ${typeof v === 'object' ? JSON.stringify(v) : String(v)}`)
    .join(', ');
}

export function AuditTable({ events }: { events: AuditEvent[] }) {
  return (
    <div className="overflow-x-auto border border-ink/80 bg-paper-raised">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Audit log, newest first</caption>
        <thead>
          <tr className="border-b border-ink/80 bg-paper-sunk/60">
            <th scope="col" className="label-caps w-48 px-4 py-2.5 font-normal">When</th>
            <th scope="col" className="label-caps px-4 py-2.5 font-normal">What</th>
            <th scope="col" className="label-caps px-4 py-2.5 font-normal">Who</th>
            <th scope="col" className="label-caps px-4 py-2.5 font-normal">Concerning</th>
            <th scope="col" className="label-caps px-4 py-2.5 font-normal">Detail</th>
          </tr>
        </thead>
        <tbody>
          {events.map((e) => (
            <tr key={e.id} className="border-b border-line align-top last:border-b-0">
              <td className="figures px-4 py-2.5 text-ink-soft">
                <time dateTime={e.createdAt}>{dateFormat.format(new Date(e.createdAt))}</time>
              </td>
              <td className="px-4 py-2.5">
                <span className="font-medium">{AUDIT_ACTION_LABELS[e.action] ?? e.action}</span>
                <span className="block font-mono text-[0.7rem] text-ink-faint">{e.action}</span>
              </td>
              <td className="px-4 py-2.5 text-ink-soft">{e.actor ?? '—'}</td>
              <td className="px-4 py-2.5">{e.target ?? '—'}</td>
              <td className="px-4 py-2.5 text-ink-soft">{describeDetail(e) || '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
