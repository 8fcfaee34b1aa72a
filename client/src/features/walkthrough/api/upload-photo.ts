import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { jobKeys, roomPath } from '../../../lib/job-queries';
import { photoRecord } from '../../../lib/job-records';
import { versionedFetch } from '../../../lib/versioned-request';

const photoResponse = z.object({ photo: photoRecord });

/** POST /api/jobs/:jobId/rooms/:roomId/photos, multipart field "file". */
export async function uploadPhoto({ jobId, roomId, file }: { jobId: string; roomId: string; file: File }) {
  const form = new FormData();
  form.append('file', file, file.name);
  return (await versionedFetch(`${roomPath(jobId, roomId)}/photos`, { method: 'POST', body: form, schema: photoResponse })).photo;
}

export function useUploadPhoto(jobId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadPhoto,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: jobKeys.rooms(jobId) }),
  });
}
