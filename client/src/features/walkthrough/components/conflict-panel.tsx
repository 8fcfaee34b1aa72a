import { useQuery, useQueryClient, type UseQueryResult } from '@tanstack/react-query';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Spinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-error';
import { getJob } from '../../../entities/job/queries';
import { jobKeys } from '../../../entities/job/query-keys';
import type { JobRecord, RoomRecord } from '@contract';
import { getRoom } from '../api/get-room';
import { changedLine, diffFields, mergeChoices, type Choice } from '../../../lib/offline/conflict';
import { deviceLabel } from '../../../lib/device';
import { describe, JOB_FIELD_LABELS, ROOM_FIELD_LABELS } from '../model/conflict';
import { DETAIL_FIELDS } from '../../../entities/job/requests';
import type { WalkthroughItem } from '../sync/edits';
import { customerQueryOptions, getCustomer } from '../../../entities/job/queries';
import { useWalkthroughQueue } from '../sync/queue-context';
import { ConflictChoices } from '../../../lib/offline/conflict-choices';

/**
 * Shown when the server answered 409 to the oldest waiting edit. Reads the record as it is
 * now, shows both values and writes the person's choice against the server's new version.
 */
export function ConflictPanel({ item, onResolved }: { item: WalkthroughItem; onResolved: () => void }) {
  const edit = item.payload;
  if (edit.kind === 'job-update') return <JobConflict item={item} jobId={edit.jobId} onResolved={onResolved} />;
  if (edit.kind === 'customer-update')
    return <CustomerConflict item={item} customerId={edit.customerId} onResolved={onResolved} />;
  if (edit.kind === 'room-create') return null;
  return <RoomConflict item={item} jobId={edit.jobId} roomId={edit.roomId} onResolved={onResolved} />;
}

/** The person's answer over `item`, then `onResolved`: keep theirs (drop the waiting edits) or send mine on their version. */
function useResolve(item: WalkthroughItem, onResolved: () => void) {
  const queue = useWalkthroughQueue();
  return {
    drop: () => void queue.resolveConflict(item.id, 'drop').then(onResolved),
    send: (payload: WalkthroughItem['payload'], baseVersion: number) =>
      void queue.resolveConflict(item.id, { payload, baseVersion }).then(onResolved),
  };
}

/** While the record as saved now is read; or why it could not be (`what`: "the job"). */
function NotReadYet({ query, what }: { query: UseQueryResult<unknown>; what: string }) {
  if (query.isPending) return <Spinner label="Reading the saved version…" />;
  return (
    <Alert tone="danger" title={`Could not read ${what} as saved now.`}>
      {errorMessage(query.error)}
    </Alert>
  );
}

function RoomConflict({
  item,
  jobId,
  roomId,
  onResolved,
}: {
  item: WalkthroughItem;
  jobId: string;
  roomId: string;
  onResolved: () => void;
}) {
  const { drop, send } = useResolve(item, onResolved);
  const queryClient = useQueryClient();
  const current = useQuery({
    queryKey: [...jobKeys.rooms(jobId), roomId, 'current', item.id],
    queryFn: () => getRoom(jobId, roomId),
    retry: false,
  });
  const edit = item.payload;

  const keepTheirs = (room: RoomRecord) => {
    queryClient.setQueryData<RoomRecord[]>(jobKeys.rooms(jobId), (rooms) =>
      rooms?.map((r) => (r.id === room.id ? room : r)),
    );
  };

  if (current.isPending) return <Spinner label="Reading the saved version…" />;
  if (current.isError) {
    return (
      <Alert tone="danger" title="This room was changed or removed by someone else.">
        <p>{errorMessage(current.error)}</p>
        <Button className="mt-2" variant="secondary" onClick={drop}>
          Discard my change
        </Button>
      </Alert>
    );
  }
  const theirs = current.data;
  if (edit.kind === 'room-delete') {
    return (
      <Alert tone="danger" title={`“${String(theirs.input.name ?? 'This room')}” was changed after you deleted it.`}>
        <p>{changedLine(theirs, deviceLabel())}</p>
        <div className="mt-2 flex flex-wrap gap-2">
          <Button variant="danger" onClick={() => send(edit, theirs.version)}>
            Delete it anyway
          </Button>
          <Button
            variant="secondary"
            onClick={() => {
              keepTheirs(theirs);
              drop();
            }}
          >
            Keep the room
          </Button>
        </div>
      </Alert>
    );
  }
  if (edit.kind !== 'room-update') return null;
  const diffs = diffFields(edit.input, theirs.input, ROOM_FIELD_LABELS);
  const handleResolve = (choices: Record<string, Choice>) => {
    const keepsMine = Object.values(choices).some((c) => c === 'mine');
    if (!keepsMine) {
      keepTheirs(theirs);
      drop();
      return;
    }
    const input = { ...mergeChoices(edit.input, theirs.input, choices), id: roomId };
    send({ ...edit, input }, theirs.version);
  };
  return (
    <ConflictChoices
      key={item.id}
      title={`“${String(theirs.input.name ?? 'Room')}” was changed meanwhile`}
      changed={changedLine(theirs, deviceLabel())}
      diffs={diffs}
      describe={describe}
      onResolve={handleResolve}
    />
  );
}

function JobConflict({ item, jobId, onResolved }: { item: WalkthroughItem; jobId: string; onResolved: () => void }) {
  const { drop, send } = useResolve(item, onResolved);
  const queryClient = useQueryClient();
  const current = useQuery({
    queryKey: [...jobKeys.detail(jobId), 'current', item.id],
    queryFn: ({ signal }) => getJob(jobId, signal),
    retry: false,
  });
  const edit = item.payload;
  if (edit.kind !== 'job-update') return null;
  if (!current.isSuccess) return <NotReadYet query={current} what="the job" />;
  const theirs: JobRecord = current.data;
  const mine = edit.changes.designConditions ?? {};
  const theirValues = theirs.designConditions ?? {};
  const mineDetails: Record<string, unknown> = {};
  for (const k of DETAIL_FIELDS) if (edit.changes[k] !== undefined) mineDetails[k] = edit.changes[k];
  const theirDetails: Record<string, unknown> = {
    ...theirs.site,
    notes: theirs.notes,
    salespersonId: theirs.salesperson?.id ?? '',
    assignedInstallerId: theirs.assignedInstaller?.id ?? null,
  };
  const diffs = [
    ...diffFields(mine, theirValues, JOB_FIELD_LABELS),
    ...diffFields(mineDetails, theirDetails, DETAIL_FIELD_LABELS),
  ].filter((d) => d.mine !== undefined);
  const handleResolve = (choices: Record<string, Choice>) => {
    queryClient.setQueryData(jobKeys.detail(jobId), theirs);
    if (!Object.values(choices).some((c) => c === 'mine')) {
      drop();
      return;
    }
    const changes: Record<string, unknown> = { ...edit.changes };
    for (const k of DETAIL_FIELDS) if (choices[k] === 'theirs') delete changes[k];
    if (edit.changes.designConditions) {
      const entered: Record<string, number | string> = {};
      for (const [k, v] of Object.entries(mergeChoices(mine, theirValues, choices))) {
        if ((k in mine || choices[k] === 'mine') && (typeof v === 'number' || typeof v === 'string')) entered[k] = v;
      }
      changes.designConditions = entered;
    }
    send({ ...edit, changes }, theirs.version);
  };
  return (
    <ConflictChoices
      key={item.id}
      title="The job was changed meanwhile"
      changed={changedLine(theirs, deviceLabel())}
      diffs={diffs}
      describe={describe}
      onResolve={handleResolve}
    />
  );
}

const DETAIL_FIELD_LABELS: Record<string, string> = {
  street: 'Street address',
  unit: 'Unit or apartment',
  city: 'City or town',
  region: 'State or region',
  postalCode: 'Postal code',
  notes: 'Job notes',
  salespersonId: 'Salesperson',
  assignedInstallerId: 'Installer',
};

const CUSTOMER_FIELD_LABELS: Record<string, string> = {
  name: 'Customer name',
  email: 'Customer e-mail',
  phone: 'Customer phone',
};

function CustomerConflict({
  item,
  customerId,
  onResolved,
}: {
  item: WalkthroughItem;
  customerId: string;
  onResolved: () => void;
}) {
  const { drop, send } = useResolve(item, onResolved);
  const queryClient = useQueryClient();
  const options = customerQueryOptions(customerId);
  const current = useQuery({
    queryKey: [...options.queryKey, 'current', item.id],
    queryFn: ({ signal }) => getCustomer(customerId, signal),
    retry: false,
  });
  const edit = item.payload;
  if (edit.kind !== 'customer-update') return null;
  if (!current.isSuccess) return <NotReadYet query={current} what="the customer" />;
  const theirs = current.data;
  const mine: Record<string, unknown> = { ...edit.changes };
  const diffs = diffFields(mine, theirs, CUSTOMER_FIELD_LABELS).filter((d) => d.mine !== undefined);
  const handleResolve = (choices: Record<string, Choice>) => {
    queryClient.setQueryData(options.queryKey, theirs);
    const changes = Object.fromEntries(Object.entries(edit.changes).filter(([k]) => choices[k] === 'mine'));
    if (Object.keys(changes).length === 0) {
      drop();
      return;
    }
    send({ ...edit, changes }, theirs.version);
  };
  return (
    <ConflictChoices
      key={item.id}
      title={`The contact details of ${theirs.name} were changed meanwhile`}
      changed={changedLine(theirs, deviceLabel())}
      diffs={diffs}
      onResolve={handleResolve}
    />
  );
}
