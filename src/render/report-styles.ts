/**
 * The report's CSS, shared by the web page and the exported self-contained HTML so
 * both look the same. Our own layout and colours; prints cleanly (white paper, no
 * controls, figures kept whole on a page).
 */
export const reportStyles = `
.rf-report { --rf-ink: #1b2a33; --rf-muted: #55636d; --rf-line: #d3dadf; --rf-paper: #fffefa;
  --rf-wash: #f3f1ea; --rf-pass: #2d6f43; --rf-fail: #a3261d; --rf-undecided: #8a5d00; --rf-accent: #1f5f7a;
  color: var(--rf-ink); font: 15px/1.45 system-ui, "Liberation Sans", Arial, sans-serif; }
.rf-report h2 { font-size: 1.35rem; margin: 0 0 .4rem; }
.rf-report h3 { font-size: 1.05rem; margin: 0 0 .4rem; }
.rf-report p { margin: .35rem 0; }
.rf-survey, .rf-fleet { background: var(--rf-paper); border: 1px solid var(--rf-line); border-radius: 6px;
  padding: 1rem 1.1rem; margin: 0 0 1.2rem; }
.rf-survey-head { border-bottom: 3px solid var(--rf-accent); padding-bottom: .5rem; margin-bottom: .8rem; }
.rf-coil-id { font-family: "Liberation Mono", ui-monospace, monospace; background: var(--rf-wash); padding: 0 .3rem; border-radius: 3px; }
.rf-date { color: var(--rf-muted); font-weight: normal; }
.rf-facts { display: flex; flex-wrap: wrap; gap: .3rem 1.4rem; margin: 0; }
.rf-facts div { display: flex; gap: .4rem; }
.rf-facts dt { color: var(--rf-muted); }
.rf-facts dd { margin: 0; font-weight: 600; overflow-wrap: break-word; min-width: 0; }
.rf-block { margin: 1rem 0; }
.rf-sub { color: var(--rf-muted); font-size: .9rem; }
.rf-note { color: var(--rf-muted); font-size: .85rem; }
.rf-empty { font-style: italic; color: var(--rf-muted); }
.rf-table { border-collapse: collapse; width: 100%; font-size: .9rem; margin: .3rem 0; }
.rf-table th, .rf-table td { border-bottom: 1px solid var(--rf-line); padding: .25rem .5rem; text-align: left; vertical-align: top; overflow-wrap: break-word; }
.rf-table .rf-nowrap { white-space: nowrap; }
.rf-table thead th { background: var(--rf-wash); font-weight: 600; }
.rf-num { font-variant-numeric: tabular-nums; white-space: nowrap; }
.rf-undetermined { color: var(--rf-undecided); font-style: italic; white-space: normal; }
.rf-best th { color: var(--rf-accent); }
.rf-figure { margin: 1rem 0; break-inside: avoid; page-break-inside: avoid; }
.rf-figure-title { font-weight: 600; margin-bottom: .3rem; }
.rf-canvas-box { overflow-x: auto; }
.rf-canvas-box canvas, .rf-canvas-box svg { display: block; max-width: 100%; height: auto !important; }
.rf-legend { list-style: none; padding: 0; margin: .3rem 0; display: flex; flex-wrap: wrap; gap: .2rem 1rem; font-size: .85rem; }
.rf-legend li { display: flex; align-items: center; gap: .35rem; }
.rf-swatch { display: inline-block; width: 22px; height: 10px; }
.rf-swatch-point { width: 9px; height: 9px; border-radius: 50%; background: var(--swatch); }
.rf-swatch-triangle { width: 0; height: 0; border-left: 6px solid transparent; border-right: 6px solid transparent; border-bottom: 10px solid var(--swatch); }
.rf-swatch-line { height: 0; border-top: 3px solid var(--swatch); }
.rf-swatch-dashed { height: 0; border-top: 3px dashed var(--swatch); }
.rf-swatch-band { background: var(--swatch); }
.rf-status { font-weight: 700; text-transform: uppercase; letter-spacing: .03em; }
.rf-status.rf-status-pass { color: var(--rf-pass); }
.rf-status.rf-status-fail { color: var(--rf-fail); }
.rf-status.rf-status-inconclusive { color: var(--rf-undecided); }
.rf-verdict { border-left: 6px solid var(--rf-undecided); padding: .5rem .8rem; background: var(--rf-wash); }
.rf-verdict.rf-status-pass { border-left-color: var(--rf-pass); }
.rf-verdict.rf-status-fail { border-left-color: var(--rf-fail); }
.rf-checks .rf-check tr:first-child th, .rf-checks .rf-check tr:first-child td { border-bottom: none; padding-bottom: 0; }
.rf-evidence td { color: var(--rf-muted); font-size: .85rem; padding-left: 1.2rem; }
.rf-flag { color: var(--rf-undecided); font-size: .8rem; font-weight: 600; }
.rf-warnings { border-left: 4px solid var(--rf-undecided); padding-left: .7rem; }
.rf-cautions { border: 1px dashed var(--rf-muted); padding: .5rem .8rem; font-size: .9rem; }
.rf-import-notes { color: var(--rf-muted); font-size: .9rem; }
.rf-other-fits summary { cursor: pointer; color: var(--rf-accent); }
.rf-doc-head { margin-bottom: 1rem; }
.rf-run-text { overflow-wrap: anywhere; font-size: .85rem; }
.rf-doc-head p { color: var(--rf-muted); }
@media (max-width: 640px) {
  .rf-survey, .rf-fleet { padding: .6rem; }
  .rf-table { font-size: .8rem; display: block; overflow-x: auto; }
  .rf-table th, .rf-table td { padding: .2rem .3rem; }
  .rf-num { white-space: normal; }
}
@media print {
  .rf-report { font-size: 11pt; }
  .rf-survey, .rf-fleet { border: none; padding: 0; break-before: page; }
  .rf-survey:first-of-type, .rf-fleet { break-before: auto; }
  .rf-canvas-box { overflow: visible; }
  .rf-table tr { break-inside: avoid; }
}
`;
