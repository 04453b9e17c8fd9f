import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button.ui';
import { TextField } from '../../../components/ui/field.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { Loading } from '../../../components/ui/loading.ui';
import { isApiError } from '../../../lib/api-client';
import { useSetUnitPrices, useUnitPriceHistory, useUnitPrices, type UnitPrices } from '../api/unit-prices.api';

const usd = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD', maximumFractionDigits: 2 });
const when = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' });

function PricesForm({ current, notYetPriced }: { current: UnitPrices | null; notYetPriced: string[] }) {
  const [steel, setSteel] = useState(current ? String(current.steel_usd_per_ton) : '');
  const [connection, setConnection] = useState(current ? String(current.connection_usd_each) : '');
  const [stud, setStud] = useState(current?.stud_usd_each != null ? String(current.stud_usd_each) : '');
  const [camber, setCamber] = useState(current?.camber_usd_each != null ? String(current.camber_usd_each) : '');
  const [note, setNote] = useState('');
  const [local, setLocal] = useState<Record<string, string>>({});
  const save = useSetUnitPrices();
  const serverFields = isApiError(save.error) ? (save.error.fields ?? {}) : {};

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const errors: Record<string, string> = {};
    const s = Number(steel);
    const c = Number(connection);
    if (steel.trim() === '' || !Number.isFinite(s) || s <= 0) errors.steel_usd_per_ton = 'Enter a price per ton in US dollars, more than zero';
    if (connection.trim() === '' || !Number.isFinite(c) || c < 0) errors.connection_usd_each = 'Enter a price per connection in US dollars, zero or more';
    // Blank = not priced (estimates leave the item out); a number must be zero or more.
    const optional = (text: string, field: string, message: string): number | null => {
      if (text.trim() === '') return null;
      const v = Number(text);
      if (!Number.isFinite(v) || v < 0) errors[field] = message;
      return v;
    };
    const st = optional(stud, 'stud_usd_each', 'Enter a price per shear stud in US dollars, zero or more, or leave it blank');
    const cb = optional(camber, 'camber_usd_each', 'Enter a price per cambered piece in US dollars, zero or more, or leave it blank');
    setLocal(errors);
    if (Object.keys(errors).length > 0) return;
    save.mutate(
      { steel_usd_per_ton: s, connection_usd_each: c, stud_usd_each: st, camber_usd_each: cb, ...(note.trim() ? { note: note.trim() } : {}) },
      { onSuccess: () => setNote('') },
    );
  };

  return (
    <form onSubmit={submit} noValidate className="grid gap-4 sm:grid-cols-2">
      <TextField
        label="Steel, fabricated and erected (US$ per ton)"
        inputMode="decimal"
        value={steel}
        onChange={(e) => setSteel(e.target.value)}
        error={local.steel_usd_per_ton ?? serverFields.steel_usd_per_ton}
        hint="Short ton of 2,000 lb, beams and girders."
      />
      <TextField
        label="Connection (US$ each)"
        inputMode="decimal"
        value={connection}
        onChange={(e) => setConnection(e.target.value)}
        error={local.connection_usd_each ?? serverFields.connection_usd_each}
        hint="Per end connection, fabricated and erected."
      />
      <TextField
        label="Shear stud (US$ each)"
        inputMode="decimal"
        optional
        value={stud}
        onChange={(e) => setStud(e.target.value)}
        error={local.stud_usd_each ?? serverFields.stud_usd_each}
        hint="Per headed stud, welded through the deck. Blank leaves studs out of estimates."
      />
      <TextField
        label="Camber (US$ per cambered piece)"
        inputMode="decimal"
        optional
        value={camber}
        onChange={(e) => setCamber(e.target.value)}
        error={local.camber_usd_each ?? serverFields.camber_usd_each}
        hint="Per beam or girder cambered in the shop. Blank leaves camber out of estimates."
      />
      <div className="sm:col-span-2">
        <TextField label="Note" optional value={note} maxLength={500} onChange={(e) => setNote(e.target.value)} hint="Where the prices come from, e.g. a fabricator's budget figure." />
      </div>
      {notYetPriced.length ? <p className="text-xs text-ink-soft sm:col-span-2">Not yet priced: {notYetPriced.join(', ').toLowerCase()}. Estimates leave them out.</p> : null}
      {save.isError && Object.keys(serverFields).length === 0 ? <FormAlert>{save.error.message}</FormAlert> : null}
      {save.isSuccess ? (
        <p role="status" className="text-sm text-ink sm:col-span-2">
          Prices saved. Every comparison now uses them; the earlier prices stay in the history.
        </p>
      ) : null}
      <div className="sm:col-span-2">
        <Button type="submit" pending={save.isPending}>
          Save prices
        </Button>
      </div>
    </form>
  );
}

/** The firm's unit prices: everyone reads them; owners and managers set them (canEdit). */
export function UnitPricesPanel({ canEdit }: { canEdit: boolean }) {
  const prices = useUnitPrices();
  const history = useUnitPriceHistory();
  if (prices.isPending) return <Loading label="Loading unit prices…" />;
  if (prices.isError) return <FormAlert>{prices.error.message}</FormAlert>;
  const current = prices.data.prices;

  return (
    <div className="flex flex-col gap-6">
      <section aria-labelledby="current-prices" className="border border-ink/80 bg-paper-raised">
        <h2 id="current-prices" className="label-caps border-b border-ink/80 px-4 py-2 text-ink">
          Current prices
        </h2>
        <div className="flex flex-col gap-4 px-4 py-4">
          {current?.example ? (
            <FormAlert tone="notice">
              These are invented example prices that come with the demo, not market prices. Set your own before relying on any cost.
            </FormAlert>
          ) : null}
          {current ? (
            <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-2 text-sm">
              <dt className="text-ink-soft">Steel, fabricated and erected</dt>
              <dd className="figures font-mono">{usd.format(current.steel_usd_per_ton)} per ton</dd>
              <dt className="text-ink-soft">Connection</dt>
              <dd className="figures font-mono">{usd.format(current.connection_usd_each)} each</dd>
              <dt className="text-ink-soft">Shear stud</dt>
              <dd className="figures font-mono">{current.stud_usd_each == null ? 'not priced' : `${usd.format(current.stud_usd_each)} each`}</dd>
              <dt className="text-ink-soft">Camber</dt>
              <dd className="figures font-mono">{current.camber_usd_each == null ? 'not priced' : `${usd.format(current.camber_usd_each)} per cambered piece`}</dd>
              <dt className="text-ink-soft">Set</dt>
              <dd>
                {when.format(new Date(current.setAt))}
                {current.setBy ? ` by ${current.setBy.name}` : ''}
              </dd>
            </dl>
          ) : (
            <p className="text-sm text-ink-soft">No prices are set for the firm yet, so Tonnage shows weights without costs.</p>
          )}
          {canEdit ? (
            <PricesForm key={current?.id ?? 'none'} current={current} notYetPriced={prices.data.notYetPriced} />
          ) : (
            <p className="text-xs text-ink-faint">Owners and managers set unit prices.{prices.data.notYetPriced.length ? ` Not yet priced: ${prices.data.notYetPriced.join(', ').toLowerCase()}.` : ''}</p>
          )}
        </div>
      </section>

      <section aria-labelledby="price-history" className="border border-ink/80 bg-paper-raised">
        <h2 id="price-history" className="label-caps border-b border-ink/80 px-4 py-2 text-ink">
          History
        </h2>
        {history.isPending ? <Loading label="Loading history…" /> : null}
        {history.isError ? <FormAlert>{history.error.message}</FormAlert> : null}
        {history.data ? (
          <div className="overflow-x-auto">
            <table className="w-full text-sm">
              <thead>
                <tr className="border-b border-ink/60 text-left">
                  <th className="label-caps px-4 py-2">Set</th>
                  <th className="label-caps px-4 py-2">By</th>
                  <th className="label-caps px-4 py-2 text-right">Steel per ton</th>
                  <th className="label-caps px-4 py-2 text-right">Per connection</th>
                  <th className="label-caps px-4 py-2 text-right">Per stud</th>
                  <th className="label-caps px-4 py-2 text-right">Per camber</th>
                  <th className="label-caps px-4 py-2">Note</th>
                </tr>
              </thead>
              <tbody>
                {history.data.map((h, i) => (
                  <tr key={h.id} className="border-b border-line last:border-b-0" aria-current={i === 0 ? 'true' : undefined}>
                    <td className="px-4 py-2 whitespace-nowrap">
                      {when.format(new Date(h.setAt))}
                      {i === 0 ? <span className="label-caps ml-2">current</span> : null}
                    </td>
                    <td className="px-4 py-2">{h.setBy?.name ?? '—'}</td>
                    <td className="px-4 py-2 text-right font-mono">{usd.format(h.steel_usd_per_ton)}</td>
                    <td className="px-4 py-2 text-right font-mono">{usd.format(h.connection_usd_each)}</td>
                    <td className="px-4 py-2 text-right font-mono">{h.stud_usd_each == null ? '—' : usd.format(h.stud_usd_each)}</td>
                    <td className="px-4 py-2 text-right font-mono">{h.camber_usd_each == null ? '—' : usd.format(h.camber_usd_each)}</td>
                    <td className="px-4 py-2 text-ink-soft">
                      {h.example ? 'Example. ' : ''}
                      {h.note ?? ''}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            {history.data.length === 0 ? <p className="px-4 py-3 text-sm text-ink-soft">No prices have been set.</p> : null}
          </div>
        ) : null}
      </section>
    </div>
  );
}
