import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { Loading } from '../../../components/ui/loading.ui';
import { useNotificationPreferences } from '../api/get-notification-preferences.api';
import type { NotificationPreferences } from '../api/notification-preferences.schema';
import { useUpdateNotificationPreferences } from '../api/update-notification-preferences.api';

// The signed-in person's own e-mail settings. Every role may set their own; the server
// decides who is written to (managers on submission, the scheme's engineers on choice).

const CHOICES: { key: keyof NotificationPreferences; label: string; hint: string }[] = [
  {
    key: 'schemeSubmitted',
    label: 'A scheme is submitted for review',
    hint: 'Sent to the firm’s managers.',
  },
  {
    key: 'schemeChosen',
    label: 'A scheme is chosen',
    hint: 'Sent to the engineers of that scheme.',
  },
];

/** The "E-mail notifications" section of Settings: loads, then the form. */
export function NotificationPreferencesSection() {
  const prefs = useNotificationPreferences();
  return (
    <section aria-labelledby="notifications-heading" className="border border-ink/80 bg-paper-raised">
      <h2 id="notifications-heading" className="label-caps border-b border-ink/80 px-4 py-2 text-ink">
        E-mail notifications
      </h2>
      <div className="px-4 py-4">
        {prefs.isPending ? (
          <Loading label="Loading your notification settings…" />
        ) : prefs.isError ? (
          <FormAlert>Your notification settings could not be loaded. {prefs.error.message}</FormAlert>
        ) : (
          <NotificationPreferencesForm initial={prefs.data} />
        )}
      </div>
    </section>
  );
}

export function NotificationPreferencesForm({ initial }: { initial: NotificationPreferences }) {
  const [values, setValues] = useState<NotificationPreferences>(initial);
  const save = useUpdateNotificationPreferences();

  const submit = (event: FormEvent) => {
    event.preventDefault();
    save.mutate(values);
  };

  const toggle = (key: keyof NotificationPreferences, checked: boolean) => {
    save.reset();
    setValues((v) => ({ ...v, [key]: checked }));
  };

  return (
    <form aria-label="E-mail notifications" onSubmit={submit} className="flex flex-col gap-4 text-sm">
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-ink-soft">E-mail me when…</legend>
        {CHOICES.map((c) => (
          <label key={c.key} className="inline-flex items-start gap-2">
            <input
              type="checkbox"
              className="mt-0.5 size-4 accent-[var(--color-accent)]"
              checked={values[c.key]}
              onChange={(e) => toggle(c.key, e.target.checked)}
            />
            <span>
              <span className="font-medium text-ink">{c.label}</span>
              <span className="block text-xs text-ink-faint">{c.hint}</span>
            </span>
          </label>
        ))}
      </fieldset>
      {save.isError ? <FormAlert>Your notification settings were not saved. {save.error.message}</FormAlert> : null}
      <div className="flex items-center gap-3">
        <Button type="submit" pending={save.isPending}>
          Save
        </Button>
        {save.isSuccess ? (
          <p role="status" className="text-ink-soft">
            Notification settings saved.
          </p>
        ) : null}
      </div>
    </form>
  );
}
