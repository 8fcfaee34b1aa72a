import { useId, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { CHANGE_AREAS, type ChangeArea, type ProposalChange, type ProposalVersionRecord } from '@contract';
import { Alert } from '../../../components/ui/alert';
import { inputClass } from '../../../components/ui/field-shell';
import { Spinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-error';
import { diffQueryOptions } from '../api/get-diff';

const areaWords: Record<ChangeArea, string> = {
  company: 'Company',
  customer: 'Customer',
  site: 'Site',
  design: 'Design conditions',
  rooms: 'Rooms and loads',
  options: 'Options',
  equipment: 'Equipment',
  'line sets': 'Line sets',
  takeoff: 'Materials and labor',
  prices: 'Prices',
  terms: 'Terms',
  cautions: 'Cautions',
};

/** "What changed" between any two versions (the server's sentences, grouped by area); newest pair first. */
export function WhatChanged({ jobId, versions }: { jobId: string; versions: readonly ProposalVersionRecord[] }) {
  const newest = versions[0]?.number ?? 1;
  const [from, setFrom] = useState(versions[1]?.number ?? newest);
  const [to, setTo] = useState(newest);
  const id = useId();
  const diff = useQuery({ ...diffQueryOptions(jobId, from, to), enabled: from !== to });
  const select = (label: string, value: number, set: (n: number) => void, key: string) => (
    <label htmlFor={`${id}-${key}`} className="flex flex-col gap-1 text-sm font-semibold text-ink-900">
      {label}
      <select id={`${id}-${key}`} className={inputClass} value={value} onChange={(e) => set(Number(e.target.value))}>
        {versions.map((v) => (
          <option key={v.number} value={v.number}>
            Version {v.number}
          </option>
        ))}
      </select>
    </label>
  );
  return (
    <section
      aria-labelledby={`${id}-heading`}
      className="flex flex-col gap-3 rounded-lg border border-line bg-white p-4"
    >
      <h2 id={`${id}-heading`} className="text-lg font-semibold text-ink-900">
        What changed
      </h2>
      {versions.length < 2 ? (
        <p className="text-base text-muted">There is one version so far. Issue another to compare them.</p>
      ) : (
        <>
          <div className="grid grid-cols-2 gap-3 sm:max-w-md">
            {select('From', from, setFrom, 'from')}
            {select('To', to, setTo, 'to')}
          </div>
          {from === to ? (
            <p className="text-base text-muted">Choose two different versions.</p>
          ) : diff.isError ? (
            <Alert tone="danger" title="Could not compare the versions.">
              {errorMessage(diff.error)}
            </Alert>
          ) : !diff.data ? (
            <Spinner label="Comparing…" />
          ) : (
            <ChangeList changes={diff.data.changes} from={from} to={to} />
          )}
        </>
      )}
    </section>
  );
}

function ChangeList({ changes, from, to }: { changes: readonly ProposalChange[]; from: number; to: number }) {
  if (changes.length === 0)
    return (
      <p className="text-base text-ink-950">
        Nothing the customer sees differs between version {from} and version {to}.
      </p>
    );
  const areas = CHANGE_AREAS.filter((a) => changes.some((c) => c.area === a));
  return (
    <div className="flex flex-col gap-3" aria-live="polite">
      <p className="text-sm text-muted">
        From version {from} to version {to}: {changes.length === 1 ? '1 change' : `${changes.length} changes`}.
      </p>
      {areas.map((area) => (
        <div key={area}>
          <h3 className="text-base font-semibold text-ink-900">{areaWords[area]}</h3>
          <ul className="mt-1 list-disc pl-5 text-base text-ink-950">
            {changes
              .filter((c) => c.area === area)
              .map((c) => (
                <li key={c.path} className="break-words">
                  {c.sentence}
                </li>
              ))}
          </ul>
        </div>
      ))}
    </div>
  );
}
