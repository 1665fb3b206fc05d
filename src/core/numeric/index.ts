export { brentMinimum } from './brent-minimum';
export { logLogLine } from './log-log-line';
export { medianOf, sampleQuantile } from './order-statistics';
