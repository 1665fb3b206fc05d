import { describeRun } from '../core/report/describe-run';
import type { RunRecord } from '../core/report/run-record';
import { html, type SafeHtml } from './html';

/**
 * "How this report was made": the run record (tool and version, time, every input file
 * with its SHA-256, every setting) as a table, the same facts the text report ends with.
 * File names are escaped like all other file text.
 */
export function renderRunSection(run: RunRecord): SafeHtml {
  return html`<section class="rf-fleet rf-run" aria-labelledby="rf-run-heading"><h2 id="rf-run-heading">How this report was made</h2>
<table class="rf-table"><tbody>${describeRun(run).map((line) => html`<tr><th scope="row" class="rf-nowrap">${line.label}</th><td class="rf-run-text">${line.text}</td></tr>`)}</tbody></table>
</section>`;
}
