import { html, trusted, type SafeHtml } from './html';
import { reportStyles } from './report-styles';

/**
 * The start of a self-contained report file, up to and including `</head>`: doctype,
 * charset, the Content Security Policy `csp`, viewport, the escaped `title`, and the
 * report styles with a body at most `maxWidth` pixels wide (plain white when printed).
 * Shared by `renderReportDocument` and the batch index page, whose CSP and width differ.
 * `csp` is written as it is (its quotes unescaped), so pass only a policy written in our code.
 */
export function documentHead(csp: string, title: string, maxWidth: number): SafeHtml {
  return html`<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="${trusted(csp)}">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${title}</title>
<style>body { margin: 0 auto; padding: 1rem; max-width: ${maxWidth}px; background: #f6f5f0; } @media print { body { background: #fff; padding: 0; } }${trusted(reportStyles)}</style>
</head>
`;
}
