import { useMutation } from '@tanstack/react-query';
import { useJobEdits, type JobEdits } from '../../../entities/job/job-edits';

/** The job details and the customer's contact, through the device's queue (see JobEdits.saveDetails). */
export function useSaveJobDetails() {
  const edits = useJobEdits();
  return useMutation({ mutationFn: (input: Parameters<JobEdits['saveDetails']>[0]) => edits.saveDetails(input) });
}
