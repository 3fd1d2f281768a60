/** Suggested fixes for problem gaps, computed with the turnover engine. */
export * from './model';
export * from './apply-changes';
export * from './suggest';
