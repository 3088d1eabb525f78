import { randomUUID } from 'node:crypto';

/**
 * Every object key is made here, by the server: never from a user's file name. Derived files have
 * fixed names under the clip's folder, so a re-run of a job overwrites them instead of adding copies.
 */
export const objectKeys = {
  original: (teamId: number, sessionId: number) => `teams/${teamId}/sessions/${sessionId}/originals/${randomUUID()}`,
  clipFolder: (teamId: number, clipId: number) => `teams/${teamId}/clips/${clipId}/`,
  poster: (teamId: number, clipId: number) => `teams/${teamId}/clips/${clipId}/poster.jpg`,
  strip: (teamId: number, clipId: number) => `teams/${teamId}/clips/${clipId}/strip.jpg`,
  rendition: (teamId: number, clipId: number) => `teams/${teamId}/clips/${clipId}/web.mp4`,
  /** A clip cut from a tape keeps its original under the clip's own folder. */
  cutOriginal: (teamId: number, clipId: number) => `teams/${teamId}/clips/${clipId}/original.mp4`,
};
