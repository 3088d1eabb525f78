import type { Clip } from '@shared/api/film';

export type StripLayout = NonNullable<Clip['strip']>;

/** Which tile of the strip is nearest to a moment: tile i shows the frame at i × intervalMs. */
export function stripTileIndex(layout: StripLayout, timeMs: number): number {
  if (layout.frames <= 0 || layout.intervalMs <= 0) return 0;
  return Math.min(layout.frames - 1, Math.max(0, Math.round(timeMs / layout.intervalMs)));
}

/**
 * CSS that shows one tile of the strip sprite (all tiles in one row) at `width` pixels wide:
 * the sprite is scaled so a tile is `width` wide, then shifted left by whole tiles.
 */
export function stripTileStyle(url: string, layout: StripLayout, timeMs: number, width = layout.tileWidth): Record<string, string> {
  const scale = width / layout.tileWidth;
  const height = Math.round(layout.tileHeight * scale);
  const index = stripTileIndex(layout, timeMs);
  return {
    'background-image': `url("${url}")`,
    'background-size': `${layout.frames * width}px ${height}px`,
    'background-position': `${-index * width}px 0px`,
    width: `${width}px`,
    height: `${height}px`,
  };
}
