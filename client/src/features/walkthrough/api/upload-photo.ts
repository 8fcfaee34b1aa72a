import { z } from 'zod';
import { roomPath } from '../../../lib/job-queries';
import { photoRecord } from '../../../lib/job-records';
import { versionedFetch } from '../../../lib/versioned-request';

const photoResponse = z.object({ photo: photoRecord });

/** POST /api/jobs/:jobId/rooms/:roomId/photos, multipart field "file" (a stored Blob keeps its name apart). */
export async function uploadPhoto({
  jobId,
  roomId,
  blob,
  fileName,
}: {
  jobId: string;
  roomId: string;
  blob: Blob;
  fileName: string;
}) {
  const form = new FormData();
  form.append('file', blob, fileName);
  return (
    await versionedFetch(`${roomPath(jobId, roomId)}/photos`, { method: 'POST', body: form, schema: photoResponse })
  ).photo;
}
