/**
 * Grading a lineman on a snap: the parts of a grade, the team's scheme, and the snap result.
 * Pure functions, used by the server when a grade is saved (the result is stored with the scheme
 * version it was made under) and by the desk to show the result as the coach types.
 */
export const MARKS = ['plus', 'minus'] as const;
export type Mark = (typeof MARKS)[number];
export const EFFORT_MARKS = ['plus', 'minus', 'loaf'] as const;
export type EffortMark = (typeof EFFORT_MARKS)[number];
export const ASSIGNMENT_MARKS = ['right', 'missed'] as const;
export type AssignmentMark = (typeof ASSIGNMENT_MARKS)[number];

/** The technique components every scheme starts with (common practice, no source). */
export const BASE_COMPONENTS = ['footwork', 'hands', 'padLevel'] as const;
export type BaseComponent = (typeof BASE_COMPONENTS)[number];

export const COMPONENT_LABELS: Record<string, string> = { footwork: 'Footwork', hands: 'Hands', padLevel: 'Pad level' };

/** Common missed-assignment reasons and penalty types; each team edits its own lists. */
export const DEFAULT_MISSED_REASONS = ['wrong gap or man', 'wrong call', 'communication', 'late off the ball', 'not on the field in time', 'wrong technique for the call'];
export const DEFAULT_PENALTY_TYPES = ['holding', 'false start', 'illegal block below the waist', 'illegal use of hands', 'chop block', 'personal foul', 'illegal man downfield'];

/** The winning-grade line many staffs use (some use 85 %). Common practice, no source. */
export const DEFAULT_WINNING_THRESHOLD = 0.8;

export interface ExtraComponent {
  key: string;
  label: string;
  active: boolean;
}

export type ResultRule =
  | { kind: 'strict' }
  /**
   * Points: each plus earns the component's weight, each minus loses it; a missed assignment
   * loses `missedPenalty`; the snap is plus when the total reaches `passPoints`.
   */
  | { kind: 'points'; weights: Record<string, number>; missedPenalty: number; passPoints: number };

export interface GradingSchemeRules {
  extraComponents: ExtraComponent[];
  missedReasons: string[];
  penaltyTypes: string[];
  resultRule: ResultRule;
  winningThreshold: number;
}

export const DEFAULT_SCHEME: GradingSchemeRules = {
  extraComponents: [],
  missedReasons: DEFAULT_MISSED_REASONS,
  penaltyTypes: DEFAULT_PENALTY_TYPES,
  resultRule: { kind: 'strict' },
  winningThreshold: DEFAULT_WINNING_THRESHOLD,
};

/** What the result depends on. */
export interface GradeMarks {
  assignment: AssignmentMark | null;
  footwork: Mark | null;
  hands: Mark | null;
  padLevel: Mark | null;
  effort: EffortMark | null;
  extra: Record<string, Mark | null>;
}

export type SnapResult = 'plus' | 'minus';

/**
 * The snap's result for one player. Strict rule (the default): plus when the assignment is right and
 * no technique component is minus; a loaf is never plus. A grade with no assignment mark yet has no
 * result (null): it counts in no rate until the coach marks it.
 */
export function snapResult(marks: GradeMarks, rule: ResultRule = { kind: 'strict' }): SnapResult | null {
  if (marks.assignment === null) return null;
  const technique: [string, Mark | null][] = [
    ['footwork', marks.footwork],
    ['hands', marks.hands],
    ['padLevel', marks.padLevel],
    ...Object.entries(marks.extra),
  ];
  if (rule.kind === 'strict') {
    if (marks.assignment !== 'right' || marks.effort === 'loaf') return 'minus';
    return technique.some(([, m]) => m === 'minus') ? 'minus' : 'plus';
  }
  let points = marks.assignment === 'missed' ? -rule.missedPenalty : (rule.weights.assignment ?? 0);
  for (const [key, mark] of [...technique, ['effort', marks.effort === 'loaf' ? 'minus' : marks.effort] as [string, Mark | null]]) {
    const weight = rule.weights[key] ?? 0;
    if (mark === 'plus') points += weight;
    if (mark === 'minus') points -= weight;
  }
  return points >= rule.passPoints ? 'plus' : 'minus';
}

/** plus ÷ (plus + minus); null when nothing was marked. Cells not graded count in neither. */
export function plusRate(plus: number, minus: number): number | null {
  return plus + minus === 0 ? null : plus / (plus + minus);
}

export interface GradeTally {
  plus: number;
  minus: number;
  rate: number | null;
}

export function tally(marks: (string | null)[], plusValue = 'plus', minusValues: string[] = ['minus']): GradeTally {
  const plus = marks.filter((m) => m === plusValue).length;
  const minus = marks.filter((m) => m !== null && minusValues.includes(m)).length;
  return { plus, minus, rate: plusRate(plus, minus) };
}
