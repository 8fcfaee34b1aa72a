import type { PhotoRecord } from '@contract';
import type { Photo } from './photo.entity';

export type PhotoView = Pick<
  Photo,
  'id' | 'contentType' | 'byteSize' | 'width' | 'height' | 'originalName' | 'createdAt'
>;

/** The only shape a photo's metadata leaves the server in (the bytes go only through the photo route). */
export function presentPhoto(p: PhotoView, jobId: string, roomId: string): PhotoRecord {
  return {
    id: p.id,
    roomId,
    url: `/api/jobs/${jobId}/rooms/${roomId}/photos/${p.id}`,
    contentType: p.contentType,
    byteSize: p.byteSize,
    width: p.width,
    height: p.height,
    originalName: p.originalName,
    createdAt: p.createdAt.toISOString(),
  };
}
