import { Suspense, useCallback } from 'react';
import { useSearchParams } from 'react-router-dom';
import { DATASETS, EDITORS, isDatasetId, MODEL_KIND_LABELS, type DataRole, type DatasetId } from '@calc';
import { PRICE_SETTINGS_ROLES, roleIn } from '@contract';
import { QueryWidgetBoundary } from '../../../components/errors/query-widget-boundary';
import { Button } from '../../../components/ui/button';
import { Spinner } from '../../../components/ui/spinner';
import { useTable } from '../api/get-table';
import { gridColumns, tablesFor } from '../model/table-view';
import { DataGrid } from './data-grid';
import { ImportPanel } from './import-panel';
import { RowPanel } from './row-panel';
import { SettingsCard } from './settings-card';

/** The catalog and price book: a tab per table, a searchable grid, a side panel for one record or an import. */
export function PriceBookPage({ role }: { role: DataRole }) {
  const [params, setParams] = useSearchParams();
  const tables = tablesFor(role);
  const asked = params.get('table') ?? '';
  const dataset: DatasetId = isDatasetId(asked) && tables.includes(asked) ? asked : (tables[0] ?? 'models');
  const set = useCallback(
    (changes: Record<string, string | null>) =>
      setParams(
        (prev) => {
          const next = new URLSearchParams(prev);
          for (const [k, v] of Object.entries(changes)) {
            if (v === null || v === '') next.delete(k);
            else next.set(k, v);
          }
          return next;
        },
        { replace: true },
      ),
    [setParams],
  );
  return (
    <div className="flex flex-col gap-4">
      <nav aria-label="Tables" className="-mx-1 flex gap-1 overflow-x-auto pb-1">
        {tables.map((id) => (
          <button
            key={id}
            type="button"
            aria-current={id === dataset ? 'page' : undefined}
            onClick={() => set({ table: id, key: null, panel: null, q: null, kind: null })}
            className={`min-h-touch whitespace-nowrap rounded-md px-3 text-base font-semibold ${id === dataset ? 'bg-ink-800 text-white' : 'bg-white text-ink-800 border border-line hover:bg-ink-50'}`}
          >
            {DATASETS[id].label}
          </button>
        ))}
      </nav>
      <QueryWidgetBoundary name={DATASETS[dataset].label.toLowerCase()}>
        <Suspense fallback={<Spinner label="Loading…" />}>
          <TableView key={dataset} dataset={dataset} role={role} params={params} set={set} />
        </Suspense>
      </QueryWidgetBoundary>
    </div>
  );
}

interface ViewProps {
  dataset: DatasetId;
  role: DataRole;
  params: URLSearchParams;
  set: (changes: Record<string, string | null>) => void;
}

function TableView({ dataset, role, params, set }: ViewProps) {
  const rows = useTable(dataset);
  const canEdit = EDITORS.includes(role);
  const q = params.get('q') ?? '';
  const kind = params.get('kind') ?? '';
  const selected = params.get('key');
  const panel = params.get('panel');
  const filtered = dataset === 'models' && kind ? rows.filter((r) => r.record['kind'] === kind) : rows;
  const open = useCallback((key: string) => set({ key, panel: 'row' }), [set]);
  const row = selected ? (rows.find((r) => r.key === selected) ?? null) : null;
  const side =
    panel === 'import' && canEdit ? (
      <ImportPanel dataset={dataset} onClose={() => set({ panel: null })} />
    ) : panel === 'new' && canEdit ? (
      <RowPanel
        key="new"
        dataset={dataset}
        role={role}
        canEdit
        row={null}
        onClose={() => set({ panel: null })}
        onSaved={(key) => set({ key, panel: 'row' })}
      />
    ) : panel === 'row' && row ? (
      <RowPanel
        key={`${row.key}@${row.version}`}
        dataset={dataset}
        role={role}
        canEdit={canEdit}
        row={row}
        onClose={() => set({ key: null, panel: null })}
        onSaved={() => undefined}
      />
    ) : null;
  return (
    <div className={`grid gap-4 ${side ? 'xl:grid-cols-[minmax(0,1fr)_minmax(26rem,34rem)]' : ''}`}>
      <div className="order-2 flex min-w-0 flex-col gap-3 xl:order-1">
        {dataset === 'categories' && roleIn(PRICE_SETTINGS_ROLES, role) ? <SettingsCard canEdit={canEdit} /> : null}
        <div className="flex flex-col gap-2 md:flex-row md:items-end">
          <label className="flex flex-1 flex-col gap-1 text-sm font-semibold text-ink-900">
            Search {DATASETS[dataset].label.toLowerCase()}
            <input
              type="search"
              value={q}
              onChange={(e) => set({ q: e.target.value })}
              className="min-h-touch rounded-md border border-line bg-white px-3 text-base font-normal"
            />
          </label>
          {dataset === 'models' ? (
            <label className="flex flex-col gap-1 text-sm font-semibold text-ink-900">
              Kind
              <select
                value={kind}
                onChange={(e) => set({ kind: e.target.value })}
                className="min-h-touch rounded-md border border-line bg-white px-3 text-base font-normal"
              >
                <option value="">Every kind</option>
                {Object.entries(MODEL_KIND_LABELS).map(([k, label]) => (
                  <option key={k} value={k}>
                    {label}
                  </option>
                ))}
              </select>
            </label>
          ) : null}
          {canEdit ? (
            <div className="flex gap-2">
              <Button variant="secondary" onClick={() => set({ panel: 'new', key: null })}>
                Add
              </Button>
              <Button onClick={() => set({ panel: 'import', key: null })}>Import CSV</Button>
            </div>
          ) : null}
        </div>
        <DataGrid
          rows={filtered}
          columns={gridColumns(dataset, role)}
          search={q}
          selectedKey={selected}
          onOpen={open}
          label={DATASETS[dataset].label}
        />
      </div>
      {side ? <div className="order-1 min-w-0 xl:order-2">{side}</div> : null}
    </div>
  );
}
