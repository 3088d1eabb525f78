/**
 * Media is served through authorized API routes (Range-capable, 206), never by public object URLs:
 * every fetch checks the caller's team membership. These build the addresses.
 */
export type MediaVariant = 'poster' | 'playback' | 'strip';

export function mediaUrl(clipId: number, variant: MediaVariant): string {
  return `/api/clips/${clipId}/${variant}`;
}
