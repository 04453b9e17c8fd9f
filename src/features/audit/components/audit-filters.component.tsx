import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button.ui';
import { TextField } from '../../../components/ui/field.ui';
import type { AuditFilters } from '../api/get-audit.api';
import { AUDIT_ACTION_LABELS } from './audit-table.component';

const AREAS: { value: string; label: string }[] = [
  { value: '', label: 'Everything' },
  { value: 'session', label: 'Sign-ins' },
  { value: 'invitation', label: 'Invitations' },
  { value: 'team', label: 'Team and roles' },
  { value: 'password', label: 'Passwords' },
  { value: 'scheme', label: 'Schemes' },
  { value: 'plan', label: 'Plan revisions' },
  { value: 'design', label: 'Design runs' },
  { value: 'prices', label: 'Unit prices' },
  ...Object.entries(AUDIT_ACTION_LABELS).map(([value, label]) => ({ value, label: `— ${label}` })),
];

export function AuditFiltersForm({
  people,
  onApply,
}: {
  people: { userId: string; name: string }[];
  onApply: (filters: AuditFilters) => void;
}) {
  const [action, setAction] = useState('');
  const [userId, setUserId] = useState('');
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');
  const [error, setError] = useState<string | null>(null);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (from && to && from > to) {
      setError('The "from" day must not be after the "to" day.');
      return;
    }
    setError(null);
    onApply({ action: action || undefined, userId: userId || undefined, from: from || undefined, to: to || undefined });
  };

  return (
    <form aria-label="Filter the audit log" onSubmit={submit} className="grid gap-4 sm:grid-cols-[1fr_1fr_10rem_10rem_auto] sm:items-end">
      <div className="flex flex-col gap-1.5">
        <label htmlFor="audit-action" className="text-sm font-medium">What</label>
        <select id="audit-action" value={action} onChange={(e) => setAction(e.target.value)} className="h-10 rounded-[3px] border border-line bg-paper-raised px-2 text-sm">
          {AREAS.map((a) => (
            <option key={a.value} value={a.value}>{a.label}</option>
          ))}
        </select>
      </div>
      <div className="flex flex-col gap-1.5">
        <label htmlFor="audit-person" className="text-sm font-medium">Who</label>
        <select id="audit-person" value={userId} onChange={(e) => setUserId(e.target.value)} className="h-10 rounded-[3px] border border-line bg-paper-raised px-2 text-sm">
          <option value="">Anyone</option>
          {people.map((p) => (
            <option key={p.userId} value={p.userId}>{p.name}</option>
          ))}
        </select>
      </div>
      <TextField label="From" type="date" value={from} onChange={(e) => setFrom(e.target.value)} error={error ?? undefined} />
      <TextField label="To" type="date" value={to} onChange={(e) => setTo(e.target.value)} />
      <Button type="submit" variant="secondary">Apply</Button>
    </form>
  );
}
