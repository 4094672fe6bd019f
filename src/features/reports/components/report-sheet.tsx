import type { MonthlyReport, ReportCell } from '../../../../shared/schemas/reports';
import { Alert } from '../../../components/ui/alert';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatDate, formatDateTime } from '../../../lib/format';

const cellText = (c: ReportCell) => (c === null ? '–' : typeof c === 'number' ? c.toLocaleString('en-GB', { maximumFractionDigits: 2 }) : c);

/**
 * A monthly report as a printable sheet (see the print rules in index.css: on paper only this sheet shows, on A4).
 * The headers of the server's tables name their units; the caution and the method are printed with it.
 */
export function ReportSheet({ report }: { report: MonthlyReport }) {
  return (
    <article className="report-sheet flex flex-col gap-5 rounded-plate border border-deck-200 bg-white p-gutter shadow-plate" data-report={report.kind}>
      <header className="border-b border-deck-200 pb-3">
        <h2>{report.title}</h2>
        <p className="text-small text-hull-600">
          {report.companyName} · {formatDate(report.from)} to {formatDate(report.to)} · generated {formatDateTime(report.generatedAt)} · amounts in {report.currency}
        </p>
      </header>
      <div data-report-caution>
        <Alert tone="error">{report.caution}</Alert>
      </div>
      <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-2 lg:grid-cols-3" data-report-summary>
        {report.summary.map((s) => (
          <div key={s.label} className="flex flex-col">
            <dt className="text-small text-hull-600">{s.label}</dt>
            <dd className="figures text-lead font-semibold">{s.value}</dd>
          </div>
        ))}
      </dl>
      {report.warnings.length > 0 ? (
        <ul className="list-disc pl-5 text-small text-hull-700" data-report-warnings>
          {report.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      ) : null}
      {report.tables.map((t) => (
        <section key={t.title} className="report-table flex flex-col gap-2">
          <h3 className="text-lead font-semibold">{t.title}</h3>
          {t.rows.length === 0 ? (
            <p className="text-small text-hull-500">No rows in this month.</p>
          ) : (
            <Table caption={t.title}>
              <thead>
                <tr>
                  {t.headers.map((h, i) => (
                    <Th key={h} numeric={t.rows.some((r) => typeof r[i] === 'number')}>
                      {h}
                    </Th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {t.rows.map((r, ri) => (
                  <tr key={ri}>
                    {r.map((c, ci) => (
                      <Td key={ci} numeric={typeof c === 'number'}>
                        {cellText(c)}
                      </Td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </Table>
          )}
        </section>
      ))}
      <section className="flex flex-col gap-1" data-report-method>
        <h3 className="text-lead font-semibold">Method</h3>
        <ul className="list-disc pl-5 text-small text-hull-700">
          {report.method.map((m) => (
            <li key={m}>{m}</li>
          ))}
        </ul>
      </section>
    </article>
  );
}

/** CSV and XLSX links of the same report (plain links: the browser downloads with the session cookie). */
export function ReportDownloads({ csvHref, xlsxHref }: { csvHref: string; xlsxHref: string }) {
  const link = 'rounded-plate border border-hull-300 bg-white px-2.5 py-1 text-small font-semibold text-hull-800 hover:bg-hull-50';
  return (
    <div className="flex flex-wrap gap-2 print:hidden">
      <a href={csvHref} download className={link} data-download="csv">
        Download CSV
      </a>
      <a href={xlsxHref} download className={link} data-download="xlsx">
        Download XLSX
      </a>
    </div>
  );
}
