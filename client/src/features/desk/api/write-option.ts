import type { QueryClient } from '@tanstack/react-query';
import type { DeskResponse, OptionRecord } from '@contract';
import { deskKeys } from '../query-keys';

/**
 * After a write: the server's answer goes into the desk at once, then the desk is fetched again (the
 * readiness and blockers are the job's, worked out by the server). Awaited by the mutations, so their
 * pending state covers the refetch and "Saved" is said only once the screen shows what the server holds.
 */
export async function landOption(
  queryClient: QueryClient,
  jobId: string,
  option: OptionRecord | null,
  removedId?: string,
) {
  queryClient.setQueryData<DeskResponse>(deskKeys.desk(jobId), (desk) => {
    if (!desk) return desk;
    let options = desk.options.filter((o) => o.id !== removedId);
    if (option)
      options = options.some((o) => o.id === option.id)
        ? options.map((o) => (o.id === option.id ? option : o))
        : [...options, option];
    return { ...desk, options };
  });
  await queryClient.invalidateQueries({ queryKey: deskKeys.desk(jobId) });
}
