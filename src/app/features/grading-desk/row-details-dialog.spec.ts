import { TestBed } from '@angular/core/testing';
import { MatDialog } from '@angular/material/dialog';
import { DEFAULT_PENALTY_TYPES } from '@shared/grading';
import { blankDraft } from './grade-draft';
import { RowDetailsData, RowDetailsDialog } from './row-details-dialog';

describe('RowDetailsDialog penalties', () => {
  async function open(penaltyTypes: readonly string[]): Promise<HTMLElement> {
    const data: RowDetailsData = { title: 'RG Dana Keel', snapOrder: 4, draft: blankDraft(), missedReasons: ['wrong gap or man'], penaltyTypes, readOnly: false };
    TestBed.inject(MatDialog).open(RowDetailsDialog, { data });
    TestBed.tick();
    await new Promise((resolve) => setTimeout(resolve, 0));
    TestBed.tick();
    return document.querySelector('tw-row-details-dialog') as HTMLElement;
  }

  afterEach(() => TestBed.inject(MatDialog).closeAll());

  it('shows the safety caution beside a list naming blocks below the waist and chop blocks', async () => {
    const dialog = await open(DEFAULT_PENALTY_TYPES);
    const note = dialog.querySelector('fieldset tw-safety-note [role=note]');
    expect(note).not.toBeNull();
    expect(note!.textContent).toContain('Safety:');
  });

  it('leaves it out when the team lists no restricted blocks', async () => {
    const dialog = await open(['holding', 'false start', 'illegal use of hands']);
    expect(dialog.querySelector('fieldset legend')?.textContent).toContain('Penalties');
    expect(dialog.querySelector('tw-safety-note')).toBeNull();
  });
});
