import { useState } from 'react';
import { CURVE_WINDOW_KINDS, CURVE_WINDOW_LABELS, type CurveWindowKind } from '../../../../shared/schemas/curves';
import { Button } from '../../../components/ui/button';
import { Field, Input, Select } from '../../../components/ui/form-field';
import type { CurveWindowChoice } from '../api/get-vessel-curves';

/** Window of the fits: since the last overhaul (default), rolling 90/180/365 days, or chosen dates. */
export function WindowSelector({ value, onChange }: { value: CurveWindowChoice; onChange: (w: CurveWindowChoice) => void }) {
  const [from, setFrom] = useState(value.from ?? '');
  const [to, setTo] = useState(value.to ?? '');
  const [kind, setKind] = useState<CurveWindowKind>(value.kind);
  const datesOk = /^\d{4}-\d{2}-\d{2}$/.test(from) && /^\d{4}-\d{2}-\d{2}$/.test(to) && from <= to;
  return (
    <form
      className="flex flex-wrap items-end gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        if (kind === 'custom' && datesOk) onChange({ kind, from, to });
      }}
    >
      <Field label="Window" htmlFor="curve-window">
        <Select
          id="curve-window"
          value={kind}
          onChange={(e) => {
            const k = e.target.value as CurveWindowKind;
            setKind(k);
            if (k !== 'custom') onChange({ kind: k });
          }}
        >
          {CURVE_WINDOW_KINDS.map((k) => (
            <option key={k} value={k}>
              {CURVE_WINDOW_LABELS[k]}
            </option>
          ))}
        </Select>
      </Field>
      {kind === 'custom' ? (
        <>
          <Field label="First day" htmlFor="curve-from">
            <Input id="curve-from" type="date" value={from} onChange={(e) => setFrom(e.target.value)} />
          </Field>
          <Field label="Last day" htmlFor="curve-to" error={from && to && from > to ? 'The last day must not be before the first' : undefined}>
            <Input id="curve-to" type="date" value={to} onChange={(e) => setTo(e.target.value)} />
          </Field>
          <Button type="submit" disabled={!datesOk}>
            Fit these dates
          </Button>
        </>
      ) : null}
    </form>
  );
}
