import { useEffect, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { SalesReport } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { buttonClass } from '../../../components/ui/button';
import { FieldShell, inputClass, SelectOptions } from '../../../components/ui/field-shell';
import { PageHeader } from '../../../components/ui/page-header';
import { Spinner } from '../../../components/ui/spinner';
import { errorMessage, isApiError } from '../../../lib/api-error';
import { salesReportCsvHref, useSalesReport } from '../api/get-sales-report';
import { filtersFromSearch, type ReportFilters } from '../query-keys';
import { CountBreakdown, GroupBreakdown, money, percent } from './group-chart';

/** /reports (the owner): what wins, by whom and at what sizing. Filters live in the URL; the CSV has the same figures. */
export function ReportsPage() {
  const [params, setParams] = useSearchParams();
  const filters = filtersFromSearch(params);
  const report = useSalesReport(filters);
  const data = report.data;

  const update = (patch: Partial<ReportFilters>) => {
    const next = new URLSearchParams(params);
    for (const [k, v] of Object.entries(patch)) {
      if (v) next.set(k, v);
      else next.delete(k);
    }
    setParams(next, { replace: true });
  };
  const bad = report.isError && isApiError(report.error) ? report.error : null;
  const fieldError = (name: string) => bad?.errors.find((e) => e.path === name)?.message;

  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Reports"
        lead="Which proposals win, by whom and at what sizing. Counted from the proposals first issued in the range."
        actions={
          <a className={buttonClass('secondary')} href={salesReportCsvHref(filters)} download>
            Download CSV
          </a>
        }
      />
      <Filters filters={filters} salespeople={data?.salespeople ?? []} onChange={update} fieldError={fieldError} />
      {report.isError ? (
        <Alert tone="danger" title="The report could not be made">
          {errorMessage(report.error)}
        </Alert>
      ) : null}
      {report.isPending ? <Spinner label="Working out the report" /> : null}
      {data && !report.isError ? (
        <div data-testid="reports-results" aria-busy={report.isFetching} className="flex flex-col gap-6">
          {report.isPlaceholderData ? (
            <p role="status" className="text-sm font-semibold text-muted">
              Updating for the new filters…
            </p>
          ) : null}
          <Report data={data} />
        </div>
      ) : null}
    </div>
  );
}

function Filters({
  filters,
  salespeople,
  onChange,
  fieldError,
}: {
  filters: ReportFilters;
  salespeople: SalesReport['salespeople'];
  onChange: (patch: Partial<ReportFilters>) => void;
  fieldError: (name: string) => string | undefined;
}) {
  // Dates typed by hand reach the URL when complete (a date input gives '' until then).
  const [from, setFrom] = useState(filters.from);
  const [to, setTo] = useState(filters.to);
  useEffect(() => setFrom(filters.from), [filters.from]);
  useEffect(() => setTo(filters.to), [filters.to]);
  const any = filters.from || filters.to || filters.salesperson;
  // The server's refusal of a filter sits under that field (FieldShell gives it the id `<field id>-error`).
  const described = (id: string, name: string) => (fieldError(name) ? `${id}-error` : undefined);
  return (
    <form
      role="search"
      aria-label="Report filters"
      className="grid gap-3 sm:grid-cols-2 lg:grid-cols-[1fr_1fr_2fr_auto] lg:items-end"
      onSubmit={(e) => e.preventDefault()}
    >
      <FieldShell id="reports-from" label="Issued from" error={fieldError('from')}>
        <input
          id="reports-from"
          type="date"
          className={inputClass}
          value={from}
          aria-invalid={fieldError('from') ? true : undefined}
          aria-describedby={described('reports-from', 'from')}
          onChange={(e) => {
            setFrom(e.target.value);
            onChange({ from: e.target.value });
          }}
        />
      </FieldShell>
      <FieldShell id="reports-to" label="Issued to" error={fieldError('to')}>
        <input
          id="reports-to"
          type="date"
          className={inputClass}
          value={to}
          aria-invalid={fieldError('to') ? true : undefined}
          aria-describedby={described('reports-to', 'to')}
          onChange={(e) => {
            setTo(e.target.value);
            onChange({ to: e.target.value });
          }}
        />
      </FieldShell>
      <FieldShell
        id="reports-salesperson"
        label="Salesperson"
        error={fieldError('salesperson')}
        className="sm:col-span-2 lg:col-span-1"
      >
        <select
          id="reports-salesperson"
          className={inputClass}
          value={filters.salesperson}
          aria-invalid={fieldError('salesperson') ? true : undefined}
          aria-describedby={described('reports-salesperson', 'salesperson')}
          onChange={(e) => onChange({ salesperson: e.target.value })}
        >
          <option value="">Everyone</option>
          <SelectOptions options={salespeople.map((p) => ({ value: p.id, label: p.name }))} />
        </select>
      </FieldShell>
      <button
        type="button"
        className={buttonClass('ghost')}
        disabled={!any}
        onClick={() => onChange({ from: '', to: '', salesperson: '' })}
      >
        Clear filters
      </button>
    </form>
  );
}

function Figure({ label, value, detail }: { label: string; value: string; detail?: string }) {
  return (
    <div className="rounded-lg border border-line bg-white p-4 shadow-card">
      <dt className="text-sm font-semibold text-muted">{label}</dt>
      <dd className="mt-1 text-2xl font-semibold tabular-nums text-ink-900">{value}</dd>
      {detail ? <dd className="mt-1 text-sm text-muted">{detail}</dd> : null}
    </div>
  );
}

function Report({ data }: { data: SalesReport }) {
  const t = data.totals;
  return (
    <>
      <section aria-labelledby="reports-totals">
        <h2 id="reports-totals" className="sr-only">
          Totals
        </h2>
        <dl className="grid grid-cols-1 gap-3 min-[420px]:grid-cols-2 lg:grid-cols-4">
          <Figure
            label="Win rate (won ÷ decided)"
            value={percent(t.winRate)}
            detail={`${t.won} of ${t.decided} decided`}
          />
          <Figure label="Revenue won" value={money(t.revenueCents)} detail="Signed options, before tax" />
          <Figure
            label="Average ticket"
            value={money(t.averageTicketCents)}
            detail={`${t.won} job${t.won === 1 ? '' : 's'} won`}
          />
          <Figure
            label="Median days, first visit to signature"
            value={t.medianDaysToSignature === null ? '—' : `${t.medianDaysToSignature}`}
          />
          <Figure
            label="Outstanding proposals"
            value={`${data.outstanding.count}`}
            detail={data.outstanding.oldestDays === null ? undefined : `Oldest ${data.outstanding.oldestDays} days`}
          />
          <Figure
            label="First price to proposal"
            value={percent(data.firstPrice.conversion)}
            detail={`${data.firstPrice.proposed} of ${data.firstPrice.priced} priced jobs`}
          />
          <Figure
            label="Cancelled within three days"
            value={percent(data.cancellations.rate)}
            detail={`${data.cancellations.cancelled} of ${data.cancellations.signed} signed`}
          />
          <Figure label="Proposals" value={`${t.proposals}`} detail={`${t.won} won · ${t.lost} lost`} />
        </dl>
      </section>
      <GroupBreakdown
        id="reports-salesperson-breakdown"
        title="Win rate by salesperson"
        lead="The job's salesperson."
        head="Salesperson"
        groups={data.bySalesperson}
      />
      <GroupBreakdown
        id="reports-month"
        title="Win rate by month"
        lead="By the month each proposal was first issued."
        head="Month"
        groups={data.byMonth}
      />
      <GroupBreakdown
        id="reports-option"
        title="Win rate by option"
        lead="Each option offered counts once: won when it was the one signed."
        head="Option"
        countLabel="Offered"
        groups={data.byOption}
      />
      <GroupBreakdown
        id="reports-system"
        title="Win rate by system type"
        lead="By the options' outdoor units."
        head="System type"
        countLabel="Offered"
        groups={data.bySystemType}
      />
      <GroupBreakdown
        id="reports-sizing"
        title="Win rate by sizing"
        lead="Cooling capacity at the design temperature ÷ the home's block load. 90 – 115 % is the usual range for a single-speed unit."
        head="Capacity ÷ load"
        countLabel="Offered"
        groups={data.bySizingBand}
      />
      <div className="grid gap-6 xl:grid-cols-2">
        <CountBreakdown
          id="reports-ages"
          title="Outstanding proposals by age"
          lead="Days since the latest version was issued."
          head="Age"
          rows={data.outstanding.ages}
        />
        <CountBreakdown
          id="reports-lost"
          title="Lost reasons"
          lead="The reason chosen when each job was marked lost."
          head="Reason"
          rows={data.lostReasons.map((r) => ({ key: r.reason, label: r.reason, count: r.count }))}
        />
      </div>
    </>
  );
}
