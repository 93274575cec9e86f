/** The sizing assistant's public surface (issue 5); see docs/sizing.md. */
export { sizeDesign, type SizingResult, type SizingOptions, type BalanceBarSizing } from './sizing.ts';
export { applySizingChange, isSizingPath, SIZING_PATHS, type SizingPath } from './apply-change.ts';
export { SIZE_CATALOGUE, CATALOGUE_SOURCE, catalogueSizes, nearestSizes, type CatalogueSize, type PartKind, type SizeSeries } from './catalogue.ts';
export { Tolerances, DEFAULT_TOLERANCES, BalanceBar, balanceBarPressureRatio, balanceBarSettingForRatio } from './sizing-schema.ts';
export { splitBand, type SplitBand, type RuleBand, type IntervalSet } from './split-band.ts';
export { recommendedSplit, partOptions, splitMargin, type PartOption } from './split-options.ts';
export { masterCylinderBore, DEFAULT_MAX_LINE_PRESSURE_BAR, DEFAULT_PEDAL_FORCE_MARGIN, type BoreSizing, type BoreCandidate } from './master-cylinder-bore.ts';
export { searchValve, type ValveSearch, type ValveCandidate, type MarginMap } from './valve-search.ts';
export { robustnessModel, monteCarlo, sampleMargins, worstCorner, sensitivity, DEFAULT_SAMPLES, DEFAULT_SEED, type MonteCarlo, type Corner, type Sensitivity, type Histogram } from './robustness.ts';
export { designMargins, type DesignMargins, type RuleMargin } from './design-margins.ts';
export { sizingCurveRules, serviceRule, sizingRuleSelection, type SizingRule } from './sizing-rules.ts';
export { mulberry32, type Prng } from './prng.ts';
