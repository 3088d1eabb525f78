import type { Sort } from '@angular/material/sort';
import type { Player } from '@shared/api/roster';
import { POSITIONS } from '@shared/roster';

/** Rows the table shows: inactive entries only on request, then the filter text. */
export function visiblePlayers(players: Player[], filter: string, showInactive: boolean): Player[] {
  const needle = filter.trim().toLowerCase();
  return players.filter((p) => {
    if (!showInactive && p.status === 'inactive') return false;
    if (needle === '') return true;
    const haystack = [p.name, `#${p.jersey}`, String(p.jersey), p.positions.join(' '), p.classYear, p.status, p.accountEmail ?? '']
      .join(' ')
      .toLowerCase();
    return haystack.includes(needle) || String(p.jersey) === needle.replace(/^#/, '');
  });
}

const CLASS_ORDER = ['Fr', 'So', 'Jr', 'Sr', 'Gr'];

function sortKey(player: Player, column: string): string | number {
  switch (column) {
    case 'jersey':
      return player.jersey;
    case 'name':
      return player.name.toLowerCase();
    case 'positions':
      // Left to right along the line: LT, LG, C, RG, RT, TE.
      return player.positions.length ? POSITIONS.indexOf(player.positions[0]) : POSITIONS.length;
    case 'class':
      return CLASS_ORDER.indexOf(player.classYear) * 2 + (player.redshirt ? 1 : 0);
    case 'height':
      return player.heightIn ?? -1;
    case 'weight':
      return player.weightLb ?? -1;
    case 'status':
      return player.status;
    case 'account':
      return player.accountEmail ?? '';
    default:
      return player.jersey;
  }
}

/** Sorted copy; ties fall back to jersey so the order is stable and predictable. */
export function sortPlayers(players: Player[], sort: Sort): Player[] {
  if (!sort.active || sort.direction === '') return [...players].sort((a, b) => a.jersey - b.jersey);
  const factor = sort.direction === 'asc' ? 1 : -1;
  return [...players].sort((a, b) => {
    const ka = sortKey(a, sort.active);
    const kb = sortKey(b, sort.active);
    const order = ka < kb ? -1 : ka > kb ? 1 : 0;
    return order !== 0 ? order * factor : a.jersey - b.jersey;
  });
}
