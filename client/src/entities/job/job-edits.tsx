import { createContext, useContext, type ReactNode } from 'react';
import type { CustomerRecord, JobRecord } from '@contract';
import type { CustomerChanges, JobChanges } from './requests';

/** Where a job-details save ended: on the server, or kept on this device until the signal is back. */
export type DetailsLanding = 'server' | 'device';

/**
 * How the job screens write through the device's edit queue without knowing whose queue it is.
 * The walk-through owns the queue (features/walkthrough/sync/job-edits.ts implements this); the
 * jobs feature's details panel, status moves and delete use it through this port, so neither
 * feature imports the other.
 */
export interface JobEdits {
  /** Queue the changed details (stored on the device first), wait for the queue; throws ApiError on a conflict or refusal. */
  saveDetails(input: {
    readonly job: JobRecord;
    readonly customer: CustomerRecord;
    readonly forJob: JobChanges;
    readonly forCustomer: CustomerChanges;
  }): Promise<DetailsLanding>;
  /** Wait until every edit waiting before now has been tried (a direct write must not overtake one). */
  flush(): Promise<void>;
  /** Drop the job's edits and files still waiting on this device (it is being deleted). */
  discardJob(jobId: string): Promise<void>;
  /** The customer as the edits still waiting make it. */
  overlayCustomer(customer: CustomerRecord): CustomerRecord;
}

/** The context holds the hook that gives the port, so the port can read the contexts around its caller. */
const JobEditsContext = createContext<(() => JobEdits) | null>(null);

export function JobEditsProvider({ useEdits, children }: { useEdits: () => JobEdits; children: ReactNode }) {
  return <JobEditsContext.Provider value={useEdits}>{children}</JobEditsContext.Provider>;
}

export function useJobEdits(): JobEdits {
  const useEdits = useContext(JobEditsContext);
  if (!useEdits) throw new Error('useJobEdits needs a JobEditsProvider (the job screen route gives it).');
  return useEdits();
}
