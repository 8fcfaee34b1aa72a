import { roomPath } from '../../../entities/job/paths';
import { apiFetch } from '../../../lib/api-client';
import { photoResponse } from '@contract';

/** POST /api/jobs/:jobId/rooms/:roomId/photos, multipart field "file" (a stored Blob keeps its name apart). */
export async function uploadPhoto({
  jobId,
  roomId,
  blob,
  fileName,
  person,
}: {
  jobId: string;
  roomId: string;
  blob: Blob;
  fileName: string;
  /** The person the photo was taken by (a waiting photo is sent only under their session). */
  person?: string;
}) {
  const form = new FormData();
  form.append('file', blob, fileName);
  return (
    await apiFetch(`${roomPath(jobId, roomId)}/photos`, { method: 'POST', body: form, person, schema: photoResponse })
  ).photo;
}
