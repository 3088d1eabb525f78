import type { Config } from '../server/core/config';
import type { MediaOps } from './media-ops';

// TEMPORARY (lead, in progress): replaced by the adapter over workers/media before this slice lands.
export function createMediaOps(_config: Config): MediaOps {
  const missing = async (): Promise<never> => {
    throw new Error('media toolkit not wired yet');
  };
  return {
    probe: missing,
    poster: missing,
    strip: missing,
    rendition: missing,
    detectScenes: missing,
    cut: missing,
    withTempDir: missing,
  };
}
