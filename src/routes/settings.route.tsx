import { Link } from 'react-router-dom';
import { PageHeader } from '../components/ui/page-header.ui';
import { paths } from '../config/paths';
import { useCurrentSession } from '../features/auth/hooks/use-current-session.hook';
import { NotificationPreferencesSection } from '../features/notification-preferences/components/notification-preferences-form.component';
import { canManageTeam, ROLE_LABELS, ROLE_SUMMARIES } from '../lib/permissions';

export default function SettingsRoute() {
  const session = useCurrentSession();
  return (
    <div className="flex flex-col gap-8">
      <title>Settings · Baywright</title>
      <PageHeader eyebrow={session.firm.name} title="Settings" />
      <div className="grid gap-6 md:grid-cols-2 md:items-start">
        <section aria-labelledby="profile-heading" className="border border-ink/80 bg-paper-raised">
          <h2 id="profile-heading" className="label-caps border-b border-ink/80 px-4 py-2 text-ink">
            Profile
          </h2>
          <dl className="grid grid-cols-[8rem_1fr] gap-y-3 px-4 py-4 text-sm">
            <dt className="text-ink-soft">Name</dt>
            <dd className="font-medium">{session.user.name}</dd>
            <dt className="text-ink-soft">Email</dt>
            <dd>{session.user.email}</dd>
            <dt className="text-ink-soft">Role</dt>
            <dd>{ROLE_LABELS[session.role]}</dd>
          </dl>
        </section>
        <section aria-labelledby="firm-heading" className="border border-ink/80 bg-paper-raised">
          <h2 id="firm-heading" className="label-caps border-b border-ink/80 px-4 py-2 text-ink">
            Firm
          </h2>
          <dl className="grid grid-cols-[8rem_1fr] gap-y-3 px-4 py-4 text-sm">
            <dt className="text-ink-soft">Firm name</dt>
            <dd className="font-medium">{session.firm.name}</dd>
            <dt className="text-ink-soft">Your role</dt>
            <dd>
              {ROLE_LABELS[session.role]}
              <p className="mt-1 text-xs text-ink-soft">{ROLE_SUMMARIES[session.role].does}</p>
            </dd>
          </dl>
          {canManageTeam(session.role) ? (
            <div className="border-t border-line px-4 py-3 text-sm">
              <Link to={paths.team.href()} className="font-medium text-accent underline-offset-4 hover:underline">
                Team and roles
              </Link>
            </div>
          ) : null}
        </section>
        {/* Every role sets their own e-mail notifications. */}
        <NotificationPreferencesSection />
      </div>
    </div>
  );
}
