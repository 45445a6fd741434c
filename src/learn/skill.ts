/**
 * Skill of a predictability test: a held-out figure averaged over the repeats, kept per repeat
 * too, for the network and for each baseline. Regression: R² (with RMSE as the second figure);
 * classification: accuracy (with balanced accuracy). An integer target fitted as a regression
 * also gets the rounded-prediction hit rate (rounded.ts).
 */
import type { Evaluation } from './evaluate.ts';

export interface Skill {
  metric: 'r2' | 'accuracy';
  /** Mean over repeats, and per repeat. */
  score: number;
  perRepeat: number[];
  /** The second held-out figure: RMSE (regression) or balanced accuracy (classification), mean and per repeat. */
  secondary?: { metric: 'rmse' | 'balancedAccuracy'; score: number; perRepeat: number[] };
  /** Integer target fitted as a regression: fraction of held-out rows the rounded prediction gets exactly right. */
  roundedExact?: { score: number; perRepeat: number[] };
}

/** The held-out figures of one model on one repeat: score, second figure, rounded hit rate (NaN when not asked). */
export interface Figures {
  score: number;
  second: number;
  exact: number;
}

/** The second figure of an evaluation: RMSE (regression) or balanced accuracy (classification). */
export function secondFigure(e: Evaluation): number {
  return (e.metric === 'r2' ? e.rmse : e.balancedAccuracy) ?? Number.NaN;
}

/**
 * A Skill from per-repeat figures: the arithmetic mean of each; the second figure when every repeat
 * has one, the rounded hit rate when every repeat has one (none is NaN).
 * @example skillOf('r2', [0.5, 0.7]).score // 0.6
 */
export function skillOf(metric: 'r2' | 'accuracy', perRepeat: number[], second?: number[], exact?: number[]): Skill {
  const mean = (v: number[]) => v.reduce((a, b) => a + b, 0) / v.length;
  const out: Skill = { metric, score: mean(perRepeat), perRepeat };
  if (second && second.length === perRepeat.length) {
    out.secondary = { metric: metric === 'r2' ? 'rmse' : 'balancedAccuracy', score: mean(second), perRepeat: second };
  }
  if (exact && exact.length === perRepeat.length && exact.every((v) => !Number.isNaN(v))) out.roundedExact = { score: mean(exact), perRepeat: exact };
  return out;
}

/** One model's figures collected over repeats, turned into a Skill at the end. */
export class SkillTally {
  private readonly score: number[] = [];
  private readonly second: number[] = [];
  private readonly exact: number[] = [];

  constructor(private readonly metric: 'r2' | 'accuracy') {}

  add(f: Figures): void {
    this.score.push(f.score);
    this.second.push(f.second);
    this.exact.push(f.exact);
  }

  /** The Skill over the repeats added; `rounded: false` leaves out the rounded hit rate. */
  skill(rounded = true): Skill {
    return skillOf(this.metric, this.score, this.second, rounded ? this.exact : undefined);
  }
}
