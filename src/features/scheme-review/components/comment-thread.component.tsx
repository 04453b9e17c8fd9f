import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button.ui';
import { TextAreaField } from '../../../components/ui/field.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { Loading } from '../../../components/ui/loading.ui';
import { useAddComment, useSchemeComments } from '../api/comments.api';
import { useSchemeActivity } from '../api/get-activity.api';

const when = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' });

/** A scheme's comments (oldest first) and, for roles that may, a box to add one. */
export function CommentThread({ schemeId, canPost }: { schemeId: string; canPost: boolean }) {
  const comments = useSchemeComments(schemeId);
  const add = useAddComment(schemeId);
  const [text, setText] = useState('');
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!text.trim()) return;
    add.mutate(text, { onSuccess: () => setText('') });
  };
  return (
    <section aria-label="Comments" className="flex flex-col gap-3">
      <h3 className="label-caps text-ink">Comments</h3>
      {comments.isPending ? <Loading label="Loading comments…" /> : null}
      {comments.isError ? <FormAlert>{comments.error.message}</FormAlert> : null}
      {comments.data && comments.data.length === 0 ? <p className="text-sm text-ink-soft">No comments yet.</p> : null}
      <ol className="flex flex-col gap-2">
        {comments.data?.map((c) => (
          <li key={c.id} className="border-l-2 border-ink/30 bg-paper px-3 py-2">
            <div className="flex flex-wrap items-baseline justify-between gap-2 text-xs text-ink-soft">
              <span className="font-medium text-ink">{c.author?.name ?? 'Former member'}</span>
              <time dateTime={c.createdAt}>{when.format(new Date(c.createdAt))}</time>
            </div>
            <p className="mt-1 text-sm whitespace-pre-wrap text-ink">{c.body}</p>
          </li>
        ))}
      </ol>
      {canPost ? (
        <form onSubmit={submit} className="flex flex-col gap-2">
          <TextAreaField
            label="Add a comment"
            value={text}
            maxLength={4000}
            onChange={(e) => setText(e.target.value)}
            error={add.isError ? (add.error as { fields?: Record<string, string> }).fields?.body : undefined}
          />
          {add.isError && !(add.error as { fields?: Record<string, string> }).fields ? <FormAlert>{add.error.message}</FormAlert> : null}
          <div>
            <Button type="submit" variant="secondary" pending={add.isPending} disabled={!text.trim()}>
              Post comment
            </Button>
          </div>
        </form>
      ) : (
        <p className="text-xs text-ink-faint">Your role reads comments; engineers, managers and owners post them.</p>
      )}
    </section>
  );
}

/** What happened to a scheme, newest first. */
export function ActivityList({ schemeId }: { schemeId: string }) {
  const activity = useSchemeActivity(schemeId);
  return (
    <section aria-label="Activity" className="flex flex-col gap-2">
      <h3 className="label-caps text-ink">Activity</h3>
      {activity.isPending ? <Loading label="Loading activity…" /> : null}
      {activity.isError ? <FormAlert>{activity.error.message}</FormAlert> : null}
      <ol className="flex flex-col text-sm">
        {activity.data?.map((a, i) => (
          <li key={`${a.at}-${i}`} className="grid grid-cols-[9rem_1fr] gap-x-3 border-b border-line py-1.5 last:border-b-0">
            <time dateTime={a.at} className="figures text-xs text-ink-soft">
              {when.format(new Date(a.at))}
            </time>
            <span>
              {a.summary}
              {a.actor ? <span className="text-ink-soft"> — {a.actor.name}</span> : null}
            </span>
          </li>
        ))}
      </ol>
    </section>
  );
}
