import { Injectable } from '@angular/core';
import { MatPaginatorIntl } from '@angular/material/paginator';

/** The paginator in our words. */
@Injectable()
export class RosterPaginatorIntl extends MatPaginatorIntl {
  override itemsPerPageLabel = 'Players per page';
  override nextPageLabel = 'Next page of players';
  override previousPageLabel = 'Previous page of players';
  override firstPageLabel = 'First page';
  override lastPageLabel = 'Last page';
  override getRangeLabel = (page: number, pageSize: number, length: number): string => {
    if (length === 0) return 'No players';
    const start = page * pageSize + 1;
    const end = Math.min(length, (page + 1) * pageSize);
    return `${start}–${end} of ${length}`;
  };
}
