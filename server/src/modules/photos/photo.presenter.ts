import type { Photo } from './photo.entity';

export type PhotoView = Pick<
  Photo,
  'id' | 'contentType' | 'byteSize' | 'width' | 'height' | 'originalName' | 'createdAt'
>;

export function presentPhoto(p: PhotoView, jobId: string, roomId: string) {
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

export type PhotoDto = ReturnType<typeof presentPhoto>;
