import type { Scheme, SchemeInput } from '@shared/api/grading';
import { COMPONENT_LABELS } from '@shared/grading';

export interface ExtraDraft {
  key: string;
  label: string;
  active: boolean;
  /** Added in this edit: its key still follows its label. */
  isNew: boolean;
}

/** The scheme form as typed: lists one item a line, numbers as text until saved. */
export interface SchemeDraft {
  extraComponents: ExtraDraft[];
  missedReasons: string;
  penaltyTypes: string;
  kind: 'strict' | 'points';
  weights: Record<string, string>;
  missedPenalty: string;
  passPoints: string;
  winningPercent: string;
  designatedGraderRole: SchemeInput['designatedGraderRole'];
}

export type SchemeErrors = Partial<Record<'extraComponents' | 'missedReasons' | 'penaltyTypes' | 'weights' | 'missedPenalty' | 'passPoints' | 'winningPercent', string>>;

const BASE_WEIGHT_KEYS = ['assignment', 'footwork', 'hands', 'padLevel', 'effort'];
export const WEIGHT_LABELS: Record<string, string> = { assignment: 'Assignment right', ...COMPONENT_LABELS, effort: 'Effort' };

export function draftFromScheme(scheme: Scheme): SchemeDraft {
  const rule = scheme.resultRule;
  const weights: Record<string, string> = {};
  for (const key of [...BASE_WEIGHT_KEYS, ...scheme.extraComponents.map((c) => c.key)]) {
    weights[key] = rule.kind === 'points' ? String(rule.weights[key] ?? 0) : '1';
  }
  return {
    extraComponents: scheme.extraComponents.map((c) => ({ ...c, isNew: false })),
    missedReasons: scheme.missedReasons.join('\n'),
    penaltyTypes: scheme.penaltyTypes.join('\n'),
    kind: rule.kind,
    weights,
    missedPenalty: rule.kind === 'points' ? String(rule.missedPenalty) : '3',
    passPoints: rule.kind === 'points' ? String(rule.passPoints) : '3',
    winningPercent: String(Math.round(scheme.winningThreshold * 1000) / 10),
    designatedGraderRole: scheme.designatedGraderRole,
  };
}

/** "Eyes / target" → "eyesTarget": letters and digits, starting small, unique in the scheme. */
export function keyFromLabel(label: string, taken: readonly string[]): string {
  const words = label.normalize('NFKD').replace(/[^A-Za-z0-9 ]+/g, ' ').trim().split(/\s+/).filter(Boolean);
  let key = words.map((w, i) => (i === 0 ? w.toLowerCase() : w[0].toUpperCase() + w.slice(1).toLowerCase())).join('');
  if (!/^[a-z]/.test(key)) key = `part${key}`;
  key = key.slice(0, 28);
  if (key.length < 2) key = `${key}Part`;
  let unique = key;
  for (let n = 2; taken.includes(unique) || BASE_WEIGHT_KEYS.includes(unique); n++) unique = `${key}${n}`;
  return unique;
}

function lines(text: string): string[] {
  return [...new Set(text.split('\n').map((l) => l.trim()).filter(Boolean))];
}

function number(text: string): number | null {
  const value = Number(text.trim().replace(',', '.'));
  return text.trim() === '' || !Number.isFinite(value) ? null : value;
}

/** The PUT body, or what is wrong with the form (checked here so the coach sees it by the field). */
export function readSchemeDraft(draft: SchemeDraft): { input: SchemeInput | null; errors: SchemeErrors } {
  const errors: SchemeErrors = {};
  const extras = draft.extraComponents.map(({ key, label, active }) => ({ key, label: label.trim(), active }));
  if (extras.some((c) => !c.label)) errors.extraComponents = 'Every extra part needs a name.';
  if (extras.length > 8) errors.extraComponents = 'At most eight extra parts.';
  const missedReasons = lines(draft.missedReasons);
  const penaltyTypes = lines(draft.penaltyTypes);
  if (missedReasons.length === 0) errors.missedReasons = 'List at least one reason.';
  if (missedReasons.length > 30) errors.missedReasons = 'At most 30 reasons.';
  if (penaltyTypes.length === 0) errors.penaltyTypes = 'List at least one penalty type.';
  if (penaltyTypes.length > 30) errors.penaltyTypes = 'At most 30 penalty types.';
  const percent = number(draft.winningPercent);
  if (percent === null || percent < 50 || percent > 100) errors.winningPercent = 'Use a percentage from 50 to 100.';

  let resultRule: SchemeInput['resultRule'] = { kind: 'strict' };
  if (draft.kind === 'points') {
    const weights: Record<string, number> = {};
    for (const [key, text] of Object.entries(draft.weights)) {
      if (!BASE_WEIGHT_KEYS.includes(key) && !extras.some((c) => c.key === key && c.active)) continue;
      const w = number(text);
      if (w === null || w < 0 || w > 10) errors.weights = 'Weights are numbers from 0 to 10.';
      else weights[key] = w;
    }
    const missedPenalty = number(draft.missedPenalty);
    const passPoints = number(draft.passPoints);
    if (missedPenalty === null || missedPenalty < 0 || missedPenalty > 20) errors.missedPenalty = 'From 0 to 20 points.';
    if (passPoints === null || passPoints < -50 || passPoints > 50) errors.passPoints = 'From −50 to 50 points.';
    resultRule = { kind: 'points', weights, missedPenalty: missedPenalty ?? 0, passPoints: passPoints ?? 0 };
  }
  if (Object.keys(errors).length > 0) return { input: null, errors };
  return {
    input: { extraComponents: extras, missedReasons, penaltyTypes, resultRule, winningThreshold: (percent as number) / 100, designatedGraderRole: draft.designatedGraderRole },
    errors,
  };
}
