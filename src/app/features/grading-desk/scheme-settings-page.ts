import { DatePipe } from '@angular/common';
import { httpResource } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, linkedSignal, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { Scheme } from '@shared/api/grading';
import { ROLE_LABELS } from '@shared/roles';
import { AuthStore } from '../../core/auth/auth-store';
import { Notifier } from '../../core/feedback/notifier';
import { StatePanel } from '../../core/feedback/state-panel';
import { readApiError } from '../../core/http/api-error';
import { inlineErrors } from '../../core/http/inline-errors';
import { GradingApi } from './grading-api';
import { SchemeDraft, SchemeErrors, WEIGHT_LABELS, draftFromScheme, keyFromLabel, readSchemeDraft } from './scheme-draft';
import { SharingSettings } from './sharing-settings';

/** The team's grading scheme (extra parts, lists, the result rule, the winning line) and what it shares with players. Admins and coordinators. */
@Component({
  selector: 'tw-scheme-settings-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe, MatButtonModule, MatIconModule, RouterLink, SharingSettings, StatePanel],
  templateUrl: './scheme-settings-page.html',
  styleUrl: './scheme-settings-page.scss',
})
export class SchemeSettingsPage {
  private readonly auth = inject(AuthStore);
  private readonly api = inject(GradingApi);
  private readonly notifier = inject(Notifier);
  protected readonly roles = ['admin', 'coordinator', 'coach'] as const;
  protected readonly roleLabels = ROLE_LABELS;
  protected readonly weightLabels = WEIGHT_LABELS;

  protected readonly scheme = httpResource<Scheme>(() => {
    const teamId = this.auth.teamId();
    return teamId === null ? undefined : { url: `/api/teams/${teamId}/grading-scheme`, context: inlineErrors() };
  });
  protected readonly draft = linkedSignal<SchemeDraft | null>(() => (this.scheme.hasValue() ? draftFromScheme(this.scheme.value()) : null));
  protected readonly errors = signal<SchemeErrors>({});
  protected readonly problem = signal<string | null>(null);
  protected readonly saving = signal(false);
  protected readonly savedVersion = signal<number | null>(null);

  protected readonly weightKeys = computed(() => {
    const d = this.draft();
    return d ? ['assignment', 'footwork', 'hands', 'padLevel', ...d.extraComponents.filter((c) => c.active).map((c) => c.key), 'effort'] : [];
  });

  protected labelOf(key: string): string {
    return this.weightLabels[key] ?? this.draft()?.extraComponents.find((c) => c.key === key)?.label ?? key;
  }

  protected change(patch: Partial<SchemeDraft>): void {
    this.draft.update((d) => (d ? { ...d, ...patch } : d));
    this.savedVersion.set(null);
  }

  protected text(event: Event): string {
    return (event.target as HTMLInputElement | HTMLTextAreaElement | HTMLSelectElement).value;
  }

  protected setWeight(key: string, value: string): void {
    const d = this.draft();
    if (d) this.change({ weights: { ...d.weights, [key]: value } });
  }

  protected addExtra(): void {
    const d = this.draft();
    if (!d) return;
    const key = keyFromLabel('new part', d.extraComponents.map((c) => c.key));
    this.change({ extraComponents: [...d.extraComponents, { key, label: '', active: true, isNew: true }], weights: { ...d.weights, [key]: '1' } });
  }

  protected renameExtra(index: number, label: string): void {
    const d = this.draft();
    if (!d) return;
    const others = d.extraComponents.filter((_, i) => i !== index).map((c) => c.key);
    const extras = d.extraComponents.map((c, i) => {
      if (i !== index) return c;
      // Keys of saved parts never change: old grades refer to them.
      return c.isNew ? { ...c, label, key: keyFromLabel(label || 'new part', others) } : { ...c, label };
    });
    const old = d.extraComponents[index];
    const renamed = extras[index];
    const weights = { ...d.weights };
    if (old.key !== renamed.key) {
      weights[renamed.key] = weights[old.key] ?? '1';
      delete weights[old.key];
    }
    this.change({ extraComponents: extras, weights });
  }

  protected toggleExtra(index: number): void {
    const d = this.draft();
    if (!d) return;
    const c = d.extraComponents[index];
    // A part added in this edit and never saved can simply go; a saved one is retired.
    const extras = c.isNew ? d.extraComponents.filter((_, i) => i !== index) : d.extraComponents.map((e, i) => (i === index ? { ...e, active: !e.active } : e));
    this.change({ extraComponents: extras });
  }

  protected undo(): void {
    if (this.scheme.hasValue()) this.draft.set(draftFromScheme(this.scheme.value()));
    this.errors.set({});
    this.problem.set(null);
  }

  protected save(): void {
    const d = this.draft();
    const teamId = this.auth.teamId();
    if (!d || teamId === null) return;
    const { input, errors } = readSchemeDraft(d);
    this.errors.set(errors);
    if (!input) {
      this.problem.set('Fix the marked fields first.');
      return;
    }
    this.saving.set(true);
    this.problem.set(null);
    this.api.saveScheme(teamId, input).subscribe({
      next: (scheme) => {
        this.saving.set(false);
        this.scheme.set(scheme);
        this.savedVersion.set(scheme.version);
        this.notifier.info(`Saved as scheme version ${scheme.version}.`);
      },
      error: (failure: unknown) => {
        this.saving.set(false);
        const error = readApiError(failure);
        this.problem.set(error.message);
        const fields = Object.entries(error.fields);
        if (fields.length > 0) this.errors.set(Object.fromEntries(fields.map(([k, v]) => [k.split('.')[0] === 'winningThreshold' ? 'winningPercent' : k.split('.')[0], v])) as SchemeErrors);
      },
    });
  }
}
