import { useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { EngineerCaution } from '../components/ui/engineer-caution.ui';
import { FormAlert } from '../components/ui/form-alert.ui';
import { Loading } from '../components/ui/loading.ui';
import { paths } from '../config/paths';
import { useCurrentSession } from '../features/auth/hooks/use-current-session.hook';
import { ActivityList, CommentThread } from '../features/scheme-review/components/comment-thread.component';
import { StatusControls } from '../features/scheme-review/components/status-controls.component';
import { useComparison } from '../features/tonnage/api/get-comparison.api';
import { ComparisonView } from '../features/tonnage/components/comparison-view.component';
import type { Role } from '../lib/permissions';
import { UnitsSwitch } from '../lib/units-context';

// Who may do what on this page (the server enforces the same rules, policy.ts).
const canReview = (role: Role) => role === 'owner' || role === 'engineer' || role === 'manager';

export default function ProjectTonnageRoute() {
  const { projectId = '' } = useParams();
  const session = useCurrentSession();
  const queryClient = useQueryClient();
  const comparison = useComparison(projectId);
  const [reviewed, setReviewed] = useState<string | null>(null);
  const refresh = () => queryClient.invalidateQueries({ queryKey: ['projects', projectId] });

  return (
    <section aria-labelledby="tonnage-heading" className="flex flex-col gap-5">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="tonnage-heading" className="text-lg font-semibold text-ink">
          Tonnage
        </h2>
        <div className="flex flex-wrap items-center gap-3">
          {comparison.data ? (
            <span className="text-xs text-ink-soft">
              Designed from each scheme's current plan, {new Date(comparison.data.generatedAt).toLocaleString('en-US', { dateStyle: 'medium', timeStyle: 'short' })}
            </span>
          ) : null}
          <UnitsSwitch />
        </div>
      </div>
      <div role="note" className="border-l-4 border-notice bg-notice-wash px-4 py-2">
        <EngineerCaution />
        <p className="mt-1 text-xs text-ink-soft">Costs are estimates from unit prices, not a quotation. Connection material is not in the steel weight.</p>
      </div>

      {comparison.isPending ? <Loading label="Designing and comparing schemes…" /> : null}
      {comparison.isError ? <FormAlert>{comparison.error.message}</FormAlert> : null}
      {comparison.data ? (
        <>
          <ComparisonView
            comparison={comparison.data}
            unitPricesLink={
              <Link to={paths.unitPrices.href()} className="text-accent underline-offset-4 hover:underline">
                Unit prices
              </Link>
            }
            schemeActions={(s) =>
              canReview(session.role) ? (
                <StatusControls schemeId={s.id} schemeName={s.name} status={s.status} archived={s.archived} onChanged={refresh} />
              ) : null
            }
          />
          {comparison.data.schemes.length > 0 ? (
            <ReviewPanel
              schemes={comparison.data.schemes}
              selected={reviewed ?? (comparison.data.schemes.find((s) => s.status !== 'draft') ?? comparison.data.schemes[0]).id}
              onSelect={setReviewed}
              canPost={canReview(session.role)}
            />
          ) : null}
        </>
      ) : null}
    </section>
  );
}

function ReviewPanel({
  schemes,
  selected,
  onSelect,
  canPost,
}: {
  schemes: { id: string; name: string }[];
  selected: string;
  onSelect: (id: string) => void;
  canPost: boolean;
}) {
  return (
    <section aria-labelledby="review-heading" className="border border-ink/80 bg-paper-raised">
      <div className="flex flex-wrap items-center gap-3 border-b border-ink/80 px-4 py-2">
        <h2 id="review-heading" className="label-caps text-ink">
          Review
        </h2>
        <label className="flex items-center gap-2 text-sm">
          <span className="text-ink-soft">Scheme</span>
          <select
            value={selected}
            onChange={(e) => onSelect(e.target.value)}
            className="h-8 rounded-[3px] border border-line bg-paper-raised px-2 text-sm"
          >
            {schemes.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </select>
        </label>
      </div>
      <div className="grid gap-6 px-4 py-4 lg:grid-cols-2">
        <CommentThread key={`c-${selected}`} schemeId={selected} canPost={canPost} />
        <ActivityList key={`a-${selected}`} schemeId={selected} />
      </div>
    </section>
  );
}

