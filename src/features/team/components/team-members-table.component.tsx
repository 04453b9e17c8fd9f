import { useState } from 'react';
import { Button } from '../../../components/ui/button.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { isApiError } from '../../../lib/api-client';
import { ROLE_LABELS, ROLES, type Role } from '../../../lib/permissions';
import { useChangeRole } from '../api/change-role.api';
import { useRemoveMember } from '../api/remove-member.api';
import type { TeamMember } from '../api/team.schema';

const dateFormat = new Intl.DateTimeFormat(undefined, { year: 'numeric', month: 'short', day: '2-digit' });

/** The firm's people; owners change roles and remove people here. */
export function TeamMembersTable({ members, currentUserId }: { members: TeamMember[]; currentUserId: string }) {
  const changeRole = useChangeRole();
  const removeMember = useRemoveMember();
  const [confirming, setConfirming] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  const report = (error: unknown) =>
    setProblem(isApiError(error) ? error.message : 'Something went wrong. Try again.');

  return (
    <div className="flex flex-col gap-3">
      <FormAlert>{problem}</FormAlert>
      <div className="overflow-x-auto border border-ink/80 bg-paper-raised">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">People of your firm and their roles</caption>
          <thead>
            <tr className="border-b border-ink/80 bg-paper-sunk/60">
              <th scope="col" className="label-caps px-4 py-2.5 font-normal">Person</th>
              <th scope="col" className="label-caps px-4 py-2.5 font-normal">E-mail</th>
              <th scope="col" className="label-caps w-44 px-4 py-2.5 font-normal">Role</th>
              <th scope="col" className="label-caps hidden w-32 px-4 py-2.5 font-normal md:table-cell">Joined</th>
              <th scope="col" className="w-40 px-4 py-2.5"><span className="sr-only">Actions</span></th>
            </tr>
          </thead>
          <tbody>
            {members.map((m) => {
              const you = m.userId === currentUserId;
              return (
                <tr key={m.userId} data-testid="team-member" className="border-b border-line last:border-b-0">
                  <th scope="row" className="px-4 py-3 font-medium">
                    {m.name}
                    {you ? <span className="label-caps ml-2 text-accent-strong">you</span> : null}
                  </th>
                  <td className="px-4 py-3 text-ink-soft">{m.email}</td>
                  <td className="px-4 py-3">
                    <select
                      aria-label={`Role of ${m.name}`}
                      value={m.role}
                      disabled={changeRole.isPending}
                      onChange={(e) => {
                        setProblem(null);
                        changeRole.mutate({ userId: m.userId, role: e.target.value as Role }, { onError: report });
                      }}
                      className="h-8 w-full rounded-[3px] border border-line bg-paper-raised px-2 text-sm"
                    >
                      {ROLES.map((r) => (
                        <option key={r} value={r}>
                          {ROLE_LABELS[r]}
                        </option>
                      ))}
                    </select>
                  </td>
                  <td className="figures hidden px-4 py-3 text-ink-soft md:table-cell">
                    {dateFormat.format(new Date(m.joinedAt))}
                  </td>
                  <td className="px-4 py-3 text-right">
                    {confirming === m.userId ? (
                      <span className="inline-flex gap-1">
                        <Button
                          variant="danger"
                          className="h-8 px-2.5"
                          pending={removeMember.isPending}
                          onClick={() => {
                            setProblem(null);
                            removeMember.mutate(m.userId, { onError: report, onSettled: () => setConfirming(null) });
                          }}
                        >
                          Remove
                        </Button>
                        <Button variant="quiet" className="h-8 px-2.5" onClick={() => setConfirming(null)}>
                          Keep
                        </Button>
                      </span>
                    ) : (
                      <Button
                        variant="quiet"
                        className="h-8 px-2.5"
                        aria-label={`Remove ${m.name} from the firm`}
                        onClick={() => setConfirming(m.userId)}
                      >
                        Remove…
                      </Button>
                    )}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </div>
  );
}
