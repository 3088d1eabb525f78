import { Component, signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { SAFETY_NOTE_CSS, SafetyNote } from './safety-note';

@Component({
  imports: [SafetyNote],
  template: `<tw-safety-note [mode]="mode()" /><tw-safety-note />`,
})
class Host {
  readonly mode = signal<'compact' | 'expanded'>('compact');
}

describe('SafetyNote', () => {
  let fixture: ComponentFixture<Host>;

  async function render(mode: 'compact' | 'expanded'): Promise<HTMLElement> {
    fixture = TestBed.createComponent(Host);
    fixture.componentInstance.mode.set(mode);
    await fixture.whenStable();
    return fixture.nativeElement.querySelector('tw-safety-note') as HTMLElement;
  }

  const points = (note: HTMLElement) => note.querySelector('[data-testid=safety-points]') as HTMLElement;

  it('starts compact: one line named as a safety note, the full caution shut', async () => {
    const note = await render('compact');
    expect(note.querySelector('[role=note]')?.getAttribute('aria-label')).toBe('Safety');
    const button = note.querySelector('button') as HTMLButtonElement;
    expect(button.textContent).toMatch(/Safety:.*medical staff decides return to play/);
    expect(button.getAttribute('aria-expanded')).toBe('false');
    expect(button.getAttribute('aria-controls')).toBe(points(note).id);
    expect(points(note).classList).toContain('shut');
  });

  it('opens to the whole caution and closes again', async () => {
    const note = await render('compact');
    const button = note.querySelector('button') as HTMLButtonElement;
    button.click();
    await fixture.whenStable();
    expect(button.getAttribute('aria-expanded')).toBe('true');
    expect(points(note).classList).not.toContain('shut');
    const items = Array.from(points(note).querySelectorAll('li'), (li) => li.textContent!.trim());
    expect(items).toHaveLength(4);
    expect(items[0]).toMatch(/governing body's current rules.*blocks below the waist, chop blocks and helmet contact/);
    expect(items[1]).toMatch(/contact limits follow your state association or conference/);
    expect(items[2]).toMatch(/athletic trainer and physicians decide/);
    expect(items[3]).toMatch(/local rules or licensed practice/);
    button.click();
    await fixture.whenStable();
    expect(button.getAttribute('aria-expanded')).toBe('false');
    expect(points(note).classList).toContain('shut');
  });

  it('expanded shows the whole caution with nothing to click', async () => {
    const note = await render('expanded');
    expect(note.querySelector('button')).toBeNull();
    expect(points(note).classList).not.toContain('shut');
    expect(points(note).querySelectorAll('li')).toHaveLength(4);
  });

  it('gives each note its own list id, so every toggle controls its own caution', async () => {
    await render('compact');
    const lists = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('[data-testid=safety-points]'), (ul) => ul.id);
    expect(lists).toHaveLength(2);
    expect(new Set(lists).size).toBe(2);
  });

  it('hides the shut caution on screens only, so a printed page carries all of it', () => {
    // The one rule that hides the list sits inside @media screen; print has no rule of its own for it.
    expect(SAFETY_NOTE_CSS).toMatch(/@media screen\s*{\s*\.shut\s*{\s*display:\s*none;\s*}\s*}/);
    expect(SAFETY_NOTE_CSS.match(/\.shut\b/g)).toHaveLength(1);
    expect(SAFETY_NOTE_CSS).toMatch(/@media print\s*{[^@]*\.chevron\s*{\s*display:\s*none;/);
  });
});
