import type { Config } from '../server/core/config';
import { configureMedia, cutSegment, detectScenes, makePoster, makeRendition, makeStrip, probeMedia, withTempDir } from './media';
import type { MediaOps } from './media-ops';

/** The worker's media steps over workers/media, configured from the environment once. */
export function createMediaOps(config: Config): MediaOps {
  configureMedia({ ffmpegPath: config.ffmpegPath, ffprobePath: config.ffprobePath, timeoutMs: config.media.timeoutMs });
  return {
    probe: (input) => probeMedia(input),
    poster: async (input, output, info) => {
      await makePoster(input, output, { info });
    },
    strip: (input, output, info, frames) => makeStrip(input, output, { info, frames }),
    rendition: async (input, output, info, maxHeight) => {
      const { plan, written } = await makeRendition(input, output, { info, maxHeight });
      return written ? plan.action : 'skip';
    },
    detectScenes: (input, threshold) => detectScenes(input, threshold),
    cut: async (input, output, startMs, endMs, info) => {
      await cutSegment(input, output, { info, startSeconds: startMs / 1000, endSeconds: endMs / 1000 });
    },
    withTempDir: (fn) => withTempDir(fn),
  };
}
