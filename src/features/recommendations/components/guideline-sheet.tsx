import { OPERATING_MODE_LABELS, type Guideline } from '../../../../shared/schemas/recommendations';
import { formatDate, formatKg, formatKw, formatSfoc } from '../../../lib/format';
import { Caution } from './caution';

/** One-page printable guideline (A4, see the print rules in the page): bands per mode, dated and versioned. */
export function GuidelineSheet({ guideline }: { guideline: Guideline }) {
  return (
    <article className="guideline-sheet space-y-3 text-small" aria-label="Operating guideline">
      <header>
        <h2 className="text-lg font-bold">
          {guideline.vesselName}: which sets to run — guideline version {guideline.version}
        </h2>
        <p>
          Issued {formatDate(guideline.createdAt)}; curves:{' '}
          {guideline.units.map((u) => `${u.designation} ${u.curveSource === 'fit' ? 'fit' : 'shop test'}${u.available ? '' : ' (unavailable)'}`).join(', ')}.
        </p>
      </header>
      <Caution />
      {guideline.modes.map((m) => (
        <section key={m.mode} data-mode={m.mode}>
          <h3 className="font-semibold">
            {OPERATING_MODE_LABELS[m.mode]} — margin {formatKw(m.rule.marginKw)} or {m.rule.marginPct} %, at least {m.rule.minSets} set(s)
            {m.rule.nMinus1 ? ', N-1' : ''}, bus tie {m.rule.busTieClosed ? 'closed' : 'open'}
          </h3>
          {m.error ? <p>{m.error}</p> : null}
          <table className="w-full border-collapse">
            <thead>
              <tr className="border-b text-left">
                <th>Load band</th>
                <th>Run</th>
                <th className="text-right">Fuel/day at mid-band</th>
                <th className="text-right">Plant SFOC</th>
                <th className="text-right">Next best costs more</th>
              </tr>
            </thead>
            <tbody>
              {m.bands.map((b) => (
                <tr key={`${b.fromKw}-${b.toKw}`} className="border-b" data-band={b.designations.join('+')} data-from-kw={b.fromKw} data-to-kw={b.toKw}>
                  <td>
                    {formatKw(b.fromKw)} – {formatKw(b.toKw)}
                  </td>
                  <td>{b.designations.join(' + ')}</td>
                  <td className="text-right">{formatKg(b.fuelKgPerDay)}</td>
                  <td className="text-right">{formatSfoc(b.sfocGPerKwh)}</td>
                  <td className="text-right">{b.extraFuelNextBestKgPerDay === null ? '–' : `${formatKg(b.extraFuelNextBestKgPerDay)}/day (${b.nextBest!.designations.join(' + ')})`}</td>
                </tr>
              ))}
              {m.gaps.map((g) => (
                <tr key={`gap-${g.fromKw}`} className="border-b italic">
                  <td>
                    {formatKw(g.fromKw)} – {formatKw(g.toKw)}
                  </td>
                  <td colSpan={4}>No combination: {g.reasons[0]}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ))}
    </article>
  );
}
