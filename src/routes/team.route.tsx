import { FormAlert } from '../components/ui/form-alert.ui';
import { Loading } from '../components/ui/loading.ui';
import { PageHeader } from '../components/ui/page-header.ui';
import { TabNav } from '../components/ui/tab-nav.ui';
import { paths } from '../config/paths';
import { useCurrentSession } from '../features/auth/hooks/use-current-session.hook';
import { InviteForm } from '../features/invitations/components/invite-form.component';
import { PendingInvitations } from '../features/invitations/components/pending-invitations.component';
import { useTeam } from '../features/team/api/get-team.api';
import { TeamMembersTable } from '../features/team/components/team-members-table.component';
import { canManageTeam, ROLE_LABELS, ROLE_SUMMARIES, ROLES } from '../lib/permissions';

const TABS = [
  { label: 'People', to: paths.team.href() },
  { label: 'Outbox', to: paths.outbox.href() },
  { label: 'Audit log', to: paths.audit.href() },
];

export default function TeamRoute() {
  const session = useCurrentSession();
  if (!canManageTeam(session.role)) {
    return (
      <div className="flex flex-col gap-6">
        <title>Team · Baywright</title>
        <PageHeader title="Team" />
        <FormAlert tone="notice">Only the firm’s owner manages the team.</FormAlert>
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-6">
      <title>Team · Baywright</title>
      <PageHeader
        eyebrow={session.firm.name}
        title="Team"
        description={
          <>
            You are this firm’s <strong className="font-medium text-ink">{ROLE_LABELS[session.role].toLowerCase()}</strong>:
            you set who does what.
          </>
        }
      />
      <TabNav label="Team sections" items={TABS} />

      <section aria-labelledby="invite-heading" className="flex flex-col gap-3">
        <h2 id="invite-heading" className="text-lg font-semibold">
          Invite a person
        </h2>
        <div className="border border-ink/80 bg-paper-raised p-4">
          <InviteForm />
        </div>
      </section>

      <section aria-labelledby="people-heading" className="flex flex-col gap-3">
        <h2 id="people-heading" className="text-lg font-semibold">
          People in {session.firm.name}
        </h2>
        <MembersSection currentUserId={session.user.id} />
      </section>

      <section aria-labelledby="waiting-heading" className="flex flex-col gap-3">
        <h2 id="waiting-heading" className="text-lg font-semibold">
          Waiting invitations
        </h2>
        <PendingInvitations />
      </section>

      <section aria-labelledby="roles-heading" className="flex flex-col gap-3">
        <h2 id="roles-heading" className="text-lg font-semibold">
          Roles in {session.firm.name}
        </h2>
        <div className="overflow-x-auto border border-ink/80 bg-paper-raised">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">What each role may do</caption>
            <thead>
              <tr className="border-b border-ink/80 bg-paper-sunk/60">
                <th scope="col" className="label-caps w-32 px-4 py-2.5 font-normal">Role</th>
                <th scope="col" className="label-caps px-4 py-2.5 font-normal">Does</th>
                <th scope="col" className="label-caps px-4 py-2.5 font-normal">May not</th>
              </tr>
            </thead>
            <tbody>
              {ROLES.map((role) => (
                <tr
                  key={role}
                  aria-current={role === session.role ? 'true' : undefined}
                  className={`border-b border-line last:border-b-0 ${role === session.role ? 'bg-accent-wash/60' : ''}`}
                >
                  <th scope="row" className="px-4 py-3 font-medium">
                    {ROLE_LABELS[role]}
                    {role === session.role ? <span className="label-caps ml-2 text-accent-strong">you</span> : null}
                  </th>
                  <td className="px-4 py-3 text-ink-soft">{ROLE_SUMMARIES[role].does}</td>
                  <td className="px-4 py-3 text-ink-soft">{ROLE_SUMMARIES[role].mayNot}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>
    </div>
  );
}

function MembersSection({ currentUserId }: { currentUserId: string }) {
  const team = useTeam();
  if (team.isPending) return <Loading label="Loading the team…" />;
  if (team.isError) return <FormAlert>The team could not be loaded. {team.error.message}</FormAlert>;
  return <TeamMembersTable members={team.data} currentUserId={currentUserId} />;
}
