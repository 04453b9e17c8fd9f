import { EmptyState } from '../components/ui/empty-state.ui';
import { FormAlert } from '../components/ui/form-alert.ui';
import { Loading } from '../components/ui/loading.ui';
import { PageHeader } from '../components/ui/page-header.ui';
import { TabNav } from '../components/ui/tab-nav.ui';
import { paths } from '../config/paths';
import { useCurrentSession } from '../features/auth/hooks/use-current-session.hook';
import { useOutbox } from '../features/outbox/api/get-outbox.api';
import { OutboxList } from '../features/outbox/components/outbox-list.component';
import { isApiError } from '../lib/api-client';
import { canManageTeam } from '../lib/permissions';

const TABS = [
  { label: 'People', to: paths.team.href() },
  { label: 'Outbox', to: paths.outbox.href() },
  { label: 'Audit log', to: paths.audit.href() },
];

export default function OutboxRoute() {
  const session = useCurrentSession();
  if (!canManageTeam(session.role)) {
    return (
      <div className="flex flex-col gap-6">
        <title>Outbox · Baywright</title>
        <PageHeader title="Outbox" />
        <FormAlert tone="notice">Only the firm’s owner reads the outbox.</FormAlert>
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-6">
      <title>Outbox · Baywright</title>
      <PageHeader
        eyebrow={session.firm.name}
        title="Outbox"
        description="No mail server is set up, so Baywright keeps its e-mails here: pass each link on to the person it was meant for."
      />
      <TabNav label="Team sections" items={TABS} />
      <OutboxBody />
    </div>
  );
}

function OutboxBody() {
  const outbox = useOutbox();
  if (outbox.isPending) return <Loading label="Loading the outbox…" />;
  if (outbox.isError) {
    if (isApiError(outbox.error) && outbox.error.status === 404) {
      return (
        <FormAlert tone="notice">
          E-mail goes out through the mail server configured for Baywright, so no copies are kept here.
        </FormAlert>
      );
    }
    return <FormAlert>The outbox could not be loaded. {outbox.error.message}</FormAlert>;
  }
  if (outbox.data.length === 0) {
    return (
      <EmptyState title="No e-mails yet">
        Invitations and password links will appear here as soon as Baywright sends them.
      </EmptyState>
    );
  }
  return <OutboxList messages={outbox.data} />;
}
