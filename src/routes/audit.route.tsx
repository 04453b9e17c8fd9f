import { useState } from 'react';
import { EmptyState } from '../components/ui/empty-state.ui';
import { FormAlert } from '../components/ui/form-alert.ui';
import { Loading } from '../components/ui/loading.ui';
import { PageHeader } from '../components/ui/page-header.ui';
import { TabNav } from '../components/ui/tab-nav.ui';
import { paths } from '../config/paths';
import { useAudit, type AuditFilters } from '../features/audit/api/get-audit.api';
import { AuditFiltersForm } from '../features/audit/components/audit-filters.component';
import { AuditTable } from '../features/audit/components/audit-table.component';
import { useCurrentSession } from '../features/auth/hooks/use-current-session.hook';
import { useTeam } from '../features/team/api/get-team.api';
import { canManageTeam } from '../lib/permissions';

const TABS = [
  { label: 'People', to: paths.team.href() },
  { label: 'Outbox', to: paths.outbox.href() },
  { label: 'Audit log', to: paths.audit.href() },
];

export default function AuditRoute() {
  const session = useCurrentSession();
  if (!canManageTeam(session.role)) {
    return (
      <div className="flex flex-col gap-6">
        <title>Audit log · Baywright</title>
        <PageHeader title="Audit log" />
        <FormAlert tone="notice">Only the firm’s owner reads the audit log.</FormAlert>
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-6">
      <title>Audit log · Baywright</title>
      <PageHeader
        eyebrow={session.firm.name}
        title="Audit log"
        description="Who signed in, who was invited, whose role changed, which schemes and plans were saved and designed: the firm’s record, newest first."
      />
      <TabNav label="Team sections" items={TABS} />
      <AuditBody />
    </div>
  );
}

function AuditBody() {
  const [filters, setFilters] = useState<AuditFilters>({ limit: 200 });
  const audit = useAudit(filters);
  const team = useTeam();
  const people = (team.data ?? []).map((m) => ({ userId: m.userId, name: m.name }));
  return (
    <div className="flex flex-col gap-4">
      <div className="border border-ink/80 bg-paper-raised p-4">
        <AuditFiltersForm people={people} onApply={(f) => setFilters({ ...f, limit: 200 })} />
      </div>
      {audit.isPending ? (
        <Loading label="Loading the audit log…" />
      ) : audit.isError ? (
        <FormAlert>The audit log could not be loaded. {audit.error.message}</FormAlert>
      ) : audit.data.length === 0 ? (
        <EmptyState title="Nothing recorded for these filters">Widen the dates or choose “Everything”.</EmptyState>
      ) : (
        <AuditTable events={audit.data} />
      )}
    </div>
  );
}
