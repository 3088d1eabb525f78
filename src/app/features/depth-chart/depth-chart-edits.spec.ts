import { addCandidate, changedPositions, draftFrom, emptyDraft, MAX_PER_POSITION, removeCandidate, reorder, transfer, type ChartDraft } from './depth-chart-edits';

const chart = (): ChartDraft => ({ ...emptyDraft(), LT: [11, 21], LG: [12, 22, 32], C: [13], RG: [14], RT: [15], TE: [16] });

describe('depth chart edits', () => {
  it('reorders within a position without touching the others', () => {
    const before = chart();
    const after = reorder(before, 'LG', 2, 0);
    expect(after.LG).toEqual([32, 12, 22]);
    expect(after.LT).toBe(before.LT);
    expect(before.LG).toEqual([12, 22, 32]);
    expect(reorder(before, 'LG', 0, 99).LG).toEqual([22, 32, 12]);
    expect(reorder(before, 'LG', 5, 0)).toBe(before);
  });

  it('moves a player to another position, or copies a swing player so he is listed at both', () => {
    const moved = transfer(chart(), 'LG', 1, 'LT', 1, 'move');
    expect(moved).toEqual({ ok: true, draft: expect.objectContaining({ LT: [11, 22, 21], LG: [12, 32] }) });
    const copied = transfer(chart(), 'LG', 1, 'RG', 5, 'copy');
    expect(copied).toEqual({ ok: true, draft: expect.objectContaining({ RG: [14, 22], LG: [12, 22, 32] }) });
  });

  it('refuses to list a player twice at one position or more than the API allows', () => {
    const twice = transfer({ ...chart(), RG: [14, 22] }, 'LG', 1, 'RG', 0, 'copy', 'Rowan Pike');
    expect(twice).toEqual({ ok: false, problem: 'Rowan Pike is already listed at RG.' });
    const full = { ...chart(), RT: [1, 2, 3, 4, 5, 6, 7, 8] };
    expect(full.RT).toHaveLength(MAX_PER_POSITION);
    expect(transfer(full, 'LG', 0, 'RT', 0, 'move')).toEqual({ ok: false, problem: 'RT already has 8 candidates, the most a position can list.' });
    expect(addCandidate(chart(), 'C', 13, 'Eli Brandt')).toEqual({ ok: false, problem: 'Eli Brandt is already listed at C.' });
  });

  it('adds and removes candidates', () => {
    const added = addCandidate(chart(), 'C', 23);
    expect(added.ok && added.draft.C).toEqual([13, 23]);
    expect(removeCandidate(chart(), 'LG', 0).LG).toEqual([22, 32]);
  });

  it('sends only the positions whose order changed', () => {
    const saved = draftFrom({ LT: [{ playerId: 11 }, { playerId: 21 }], LG: [{ playerId: 12 }, { playerId: 22 }, { playerId: 32 }] });
    expect(saved.TE).toEqual([]);
    expect(changedPositions(saved, saved)).toEqual({});
    const draft = reorder(saved, 'LG', 1, 0);
    expect(changedPositions(saved, draft)).toEqual({ LG: [22, 12, 32] });
    expect(changedPositions(saved, removeCandidate(saved, 'LT', 1))).toEqual({ LT: [11] });
  });
});
