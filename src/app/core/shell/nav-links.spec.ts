import { navLinksFor, urlAllowedFor } from './nav-links';

describe('nav links and what a team shares', () => {
  const paths = (links: { path: string }[]) => links.map((l) => l.path);
  const sharing = (unitWithPlayers: boolean) => ({ gradesWithPlayers: true, unitWithPlayers });

  it("gives a player the Readiness Grid only while the team shares the line's numbers", () => {
    expect(paths(navLinksFor('player'))).not.toContain('/readiness');
    expect(paths(navLinksFor('player', sharing(false)))).not.toContain('/readiness');
    expect(paths(navLinksFor('player', sharing(true)))).toContain('/readiness');
    // Sharing opens nothing else of the staff's.
    expect(paths(navLinksFor('player', sharing(true))).filter((p) => !paths(navLinksFor('player')).includes(p))).toEqual(['/readiness']);
  });

  it('changes nothing for the staff', () => {
    for (const role of ['admin', 'coordinator', 'coach', 'analyst'] as const) {
      expect(navLinksFor(role, sharing(true))).toEqual(navLinksFor(role, sharing(false)));
      expect(paths(navLinksFor(role))).toContain('/readiness');
    }
  });

  it('keeps a player on the grid after a team switch only when the new team shares', () => {
    expect(urlAllowedFor('player', '/readiness?seasonId=5', sharing(true))).toBe(true);
    expect(urlAllowedFor('player', '/readiness', sharing(false))).toBe(false);
    expect(urlAllowedFor('player', '/study/sheets/3')).toBe(true);
  });
});
