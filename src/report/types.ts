/**
 * The input of the report: the JSON results of every stage, each optional, plus raw points for
 * the plots. Shapes follow the stages' contracts (rank, fit, search, bound); the run stage builds
 * one of these and hands it to `renderReport`.
 */

export interface Interval {
  feature: string;
  score: number;
  low: number;
  high: number;
  /** With noise probes: whether the whole interval lies above the probes' upper reference. */
  aboveNoise?: boolean;
}

export interface ReportDrops {
  inputRows: number;
  keptRows: number;
  dropped: Array<{ column: string; reason: string; rows: number }>;
  duplicates: number;
  duplicateRule: string;
}

export interface ReportRank {
  target: string;
  task: 'regression' | 'classification';
  model: {
    metric: string;
    score: number;
    baselines: { constant: number; ridge: number };
    /** The second held-out figure (RMSE for regression, balanced accuracy for classification); absent in older inputs. */
    secondary?: { metric: string; score: number; baselines: { constant: number; ridge: number } };
  };
  /** kendallTau: agreement (Kendall τ) between the method's repeats; null when not defined (one repeat, all ties). */
  methods: Record<string, { ranking: Interval[]; kendallTau: number | null }>;
  ranking: Interval[];
  /** Held-out rows, possibly sampled. Classification: `predicted` is the expected value Σ p_k·c_k. */
  predictions?: { actual: number[]; predicted: number[] };
  /** Integrated gradients only: per repeat, mean and largest |Σ attributions − (f(x) − f(baseline))| and mean |f(x) − f(baseline)|. */
  completeness?: Array<{ meanAbsGap: number; maxAbsGap: number; meanAbsDelta: number }>;
  /** Classification: held-out rows by actual class (rows) and most probable class (columns). */
  confusion?: { classes: number[]; counts: number[][] };
  /** Partial dependence of the network on the leading quantity: mean prediction at each value x. */
  dependence?: { feature: string; x: number[]; mean: number[] };
  /** Noise probes: what they were (words, e.g. "3 permuted copies (of a, b, c) and 3 Gaussian columns") and the headline reference. */
  noise?: { probes: string; reference: number };
}

export interface ReportScatter {
  x: number[];
  y: number[];
  color?: number[];
  xName: string;
  yName: string;
  colorName?: string;
  /** A label column (e.g. a family) that colours the points instead of `color`, one value per point. */
  labels?: { name: string; values: string[] };
  /** When the points handed in are already a sample, the number of rows they came from. */
  sampledFrom?: number;
}

export interface ReportFitTerm {
  term: string;
  coef: number;
  se: number;
  low: number;
  high: number;
  rational: { text: string } | null;
}

/** A stage's note: `kind` to choose on (the report never reads the words), `text` to show. */
export interface ReportNote {
  kind: string;
  text: string;
}

export interface ReportFit {
  target: string;
  n: number;
  r2: number;
  rmse: number;
  cvRmse: number;
  terms: ReportFitTerm[];
  /** Kind 'rows': rows dropped (shown, not flagged); any other kind is a warning (flagged). */
  warnings: ReportNote[];
  /** Residuals against each term; `sampledFrom`: the rows fitted, when the points are a sample of them. */
  residuals?: { byTerm: Array<{ term: string; x: number[] }>; residual: number[]; sampledFrom?: number };
}

export interface ReportCandidate {
  terms: string[];
  coefs: number[];
  heldOutRmse: number;
  complexity: number;
  /** Optional (older inputs lack them): the fitted intercept, error on the selection rows, coefficients as fractions. */
  intercept?: number;
  selectionRmse?: number;
  /** `target ≈ …` with the coefficients as fractions, when every one has a simple fraction near it. */
  rationalFormula?: string | null;
  /** Held-out RMSE of the formula with its fractions. */
  rationalHeldOutRmse?: number;
}

export interface ReportSearch {
  /** The search's name (a run's configuration block: `search 1`, … unless named); shown when a report holds several. */
  name?: string;
  candidates: ReportCandidate[];
  front: ReportCandidate[];
  mode: string;
  /** Optional (older inputs lack them). */
  target?: string;
  /** Candidate terms the subsets were drawn from, and the subsets screened in all. */
  nCandidateTerms?: number;
  nCandidatesTried?: number;
  selectionRows?: number;
  heldOutRows?: number;
  /** Standard deviation of the target on the held-out rows: the scale that makes held-out errors of different targets comparable. */
  heldOutSd?: number;
  /** Kinds 'screened' and 'multipleComparisons' are said by the report in its own words; the others are listed. */
  notes?: ReportNote[];
}

/** What a first fit leaves over, ranked (the run's `residual` key). */
export interface ReportResidual {
  target: string;
  /** The first fit's equation text, e.g. `y ≈ 1.2 + 3·a^2`, and its figures. */
  fit: string;
  r2: number;
  rmse: number;
  residualName: string;
  features: string[];
  ranking: Interval[];
  noise?: { probes: string; reference: number };
  /** Ranking of |residual|, when run. */
  absolute?: { ranking: Interval[]; noise?: { probes: string; reference: number } };
  next: { from: string[]; formula: string; heldOutRmse: number; nextTerms: string[] } | null;
  notes: ReportNote[];
}

export interface ReportWitness {
  row: number;
  lhs: number;
  rhs: number;
  ratio: number;
  /** The stratifying value of the row (the plot marks witnesses at (by, ratio)). */
  by?: number;
  labels?: Record<string, string>;
}

export interface ReportBoundResult {
  rhs: string;
  constant: number;
  witnesses: ReportWitness[];
  quantiles: Record<string, number>;
  strata: Array<{ low: number; high: number; n: number; constant: number }>;
  /** Trend of the per-stratum constant along `by`; slope and interval may be null when undetermined. */
  trend: { slope: number | null; low: number | null; high: number | null; kind?: 'none' | 'up' | 'down'; verdict: string } | null;
  /** `sampledFrom`: the rows used, when the points are a sample of them. */
  points?: { by: number[]; ratio: number[]; labels?: { name: string; values: string[] }; sampledFrom?: number };
  /** The bound stage's notes (optional: older inputs lack them); listed as they are. */
  notes?: ReportNote[];
}

export interface ReportBound {
  lhs: string;
  by?: string;
  results: ReportBoundResult[];
}

export interface ReportInput {
  title: string;
  createdAt: string;
  tool: { name: 'surmise'; version: string };
  input: { path: string; sha256: string; rows: number };
  drops?: ReportDrops;
  rank?: ReportRank;
  /** Target against the top feature, coloured by the second. */
  scatter?: ReportScatter;
  fits?: ReportFit[];
  /** One formula search (older inputs); give `searches` for several, not both. */
  search?: ReportSearch;
  /** The formula searches, in order, each with its `name`. */
  searches?: ReportSearch[];
  residual?: ReportResidual;
  bounds?: ReportBound[];
  /** The resolved configuration, shown verbatim. */
  configText?: string;
}

/** One rendered plot: `name` is a safe file stem (the lead writes plots/<name>.svg and .png). */
export interface RenderedPlot {
  name: string;
  title: string;
  svg: string;
  png: Uint8Array;
}

export interface RenderedReport {
  html: string;
  markdown: string;
  plots: RenderedPlot[];
}

export interface ReportOptions {
  /** Seed for deterministic sampling of large point sets (default 0). */
  seed?: number;
  /** Most points drawn in a point plot before it is sampled or binned (default 3000). */
  maxPoints?: number;
  /** How the target-against-top-feature plot handles more than maxPoints rows (default 'bin'). */
  scatterMode?: 'bin' | 'sample';
  /** Render PNG copies of the plots (default true). */
  png?: boolean;
  /** Width in pixels of the PNG copies (default: the SVG's own width × 2). */
  pngScale?: number;
}
