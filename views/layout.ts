/** The page shell: head, versioned asset URLs, the htmx configuration (CSP-compatible), the caution footer. */
import { CAUTION, LOCKSTEP_VERSION } from '../core/index.ts';
import { html, type SafeHtml } from './html.ts';

export interface AssetUrls {
  /** Prefix of the app's own static files, with a content hash (e.g. /static/3f2a9c01de). */
  app: string;
  htmx: string;
  plotly: string;
}

/**
 * htmx settings: no eval (the CSP forbids it), no injected indicator <style>, no script tags from responses,
 * 422 responses (invalid input) are swapped so that field messages appear.
 */
export const HTMX_CONFIG = {
  allowEval: false,
  allowScriptTags: false,
  includeIndicatorStyles: false,
  historyCacheSize: 0,
  refreshOnHistoryMiss: true,
  selfRequestsOnly: true,
  responseHandling: [
    { code: '204', swap: false },
    { code: '[23]..', swap: true },
    { code: '422', swap: true, error: false },
    { code: '[45]..', swap: true, error: true },
  ],
};

export function layout(title: string, assets: AssetUrls, body: SafeHtml, opts: { charts?: boolean } = {}): SafeHtml {
  return html`<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${title}</title>
<meta name="htmx-config" content="${JSON.stringify(HTMX_CONFIG)}">
<link rel="stylesheet" href="${assets.app}/css/workbench.css">
<link rel="icon" href="${assets.app}/favicon.svg" type="image/svg+xml">
<script src="${assets.htmx}" defer></script>
${opts.charts ? html`<script src="${assets.plotly}" defer></script>
<script src="${assets.app}/js/charts.js" defer></script>
<script src="${assets.app}/js/workbench.js" defer></script>` : ''}
</head>
<body>
${body}
<footer class="foot"><p><strong>CAUTION</strong> ${CAUTION}</p><p>Lockstep ${LOCKSTEP_VERSION}</p></footer>
</body>
</html>`;
}
