/** Where a stored photo is served from (app/api/v1/photos/[id]); the same shape wherever a photo is listed. */
export function photoUrls(photoId: string) {
  return { url: `/api/v1/photos/${photoId}`, thumbUrl: `/api/v1/photos/${photoId}/thumb` };
}
