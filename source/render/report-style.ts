/**
 * The base of every printed page: black on white, system fonts only, page margins that suit
 * both A4 and Letter (the printer picks the size), a bordered caution box, and table rows kept
 * whole across page breaks. `footer` is printed at the foot of every page; it goes into a CSS
 * string, so only plain words, digits and a little punctuation are kept.
 */
export function pageStyle(footer: string): string {
	const safe = footer.replaceAll(/[^A-Za-z0-9 .\u00B7:-]/g, '');
	return `
@page { margin: 16mm 15mm 17mm 15mm; @bottom-left { content: "${safe}"; font: 8pt Arial, "Liberation Sans", "DejaVu Sans", sans-serif; } @bottom-right { content: "page " counter(page) " of " counter(pages); font: 8pt Arial, "Liberation Sans", "DejaVu Sans", sans-serif; } }
html { color: #000; background: #fff; }
body { font: 9pt/1.3 "Helvetica Neue", Arial, "Liberation Sans", "DejaVu Sans", sans-serif; margin: 0 auto; max-width: 190mm; padding: 8mm; }
@media print { body { max-width: none; padding: 0; } }
h1 { font-size: 16pt; margin: 0 0 2mm; }
h2 { font-size: 12pt; margin: 6mm 0 2mm; border-bottom: 1px solid #000; break-after: avoid; }
.caution { border: 2px solid #000; padding: 2mm 4mm; margin: 3mm 0; break-inside: avoid; }
.caution h2 { border: 0; margin: 1mm 0; font-size: 10pt; text-transform: uppercase; letter-spacing: 0.06em; }
.caution p { margin: 1mm 0; }
.deferral { font-weight: bold; }
table { width: 100%; border-collapse: collapse; table-layout: fixed; margin: 1mm 0 3mm; }
thead { display: table-header-group; }
th { text-align: left; vertical-align: bottom; border-bottom: 1.5px solid #000; padding: 1mm 1.5mm; font-size: 8.5pt; }
td { vertical-align: top; padding: 0.8mm 1.5mm; border-bottom: 0.5px solid #888; overflow-wrap: anywhere; }
tr { break-inside: avoid; }
.number { white-space: nowrap; overflow-wrap: normal; }
`;
}

/**
 * The printed report's style: the page base, check rows kept whole across page breaks, and
 * verdicts marked by words, weight and border style so they read without colour.
 */
export function reportStyle(footer: string): string {
	return `${pageStyle(footer)}
.kind { margin: 0; font-size: 9pt; text-transform: uppercase; letter-spacing: 0.06em; }
.outcome { font-size: 12pt; margin: 0 0 3mm; }
.outcome-do_not_energize strong, .outcome-incomplete strong { border: 2px solid #000; padding: 0.5mm 2mm; }
.outcome-clear_to_energize strong { border: 1px solid #000; padding: 0.5mm 2mm; }
caption { text-align: left; font-weight: bold; padding: 1mm 0; caption-side: top; break-after: avoid; }
tbody.check, tbody.signature { break-inside: avoid; }
/* A caption and header never sit alone at a page foot. */
caption, thead { break-after: avoid; }
tbody.check tr:first-child td, tbody.signature tr:first-child td { border-bottom: 0; padding-bottom: 0; }
tr.detail td { font-size: 8.5pt; padding-top: 0.5mm; }
tr.detail p { margin: 0 0 0.5mm; }
.basis { font-style: italic; }
code { font: 8pt "DejaVu Sans Mono", Menlo, Consolas, monospace; overflow-wrap: anywhere; }
.hash { font-size: 7pt; word-break: break-all; }
.verdict { font-weight: bold; overflow-wrap: normal; }
td.verdict { border-left: 1px solid #888; }
.verdict-fail td.verdict, .answer-no td.verdict, tbody.not-verified td.verdict { border-left: 4px solid #000; text-transform: uppercase; }
.verdict-advise td.verdict { border-left: 3px dashed #000; }
.verdict-open td.verdict, .answer-unanswered td.verdict, .answer-open td.verdict { border-left: 3px dotted #000; }
.verdict-fail td, .answer-no td, tbody.not-verified td { background: #eee; }
.verdict-pass td.verdict, .verdict-skip td.verdict { font-weight: normal; }
.verdict-skip td { color: #444; }
col.c-verdict { width: 21mm; } col.c-title { width: auto; } col.c-value, col.c-limit { width: 19mm; } col.c-margin { width: 26mm; } col.c-fraction { width: 15mm; }
col.c-statement { width: 55%; } col.c-label { width: 40%; } col.c-derived { width: 62%; } col.c-si { width: 24mm; }
col.c-number { width: 6mm; } col.c-meaning { width: 20mm; } col.c-when { width: 44mm; } col.c-verified { width: 30mm; } col.c-trust { width: 36mm; }
table.details th { width: 36mm; border-bottom: 0.5px solid #888; font-size: 9pt; vertical-align: top; }
footer { margin-top: 6mm; border-top: 1px solid #000; font-size: 8.5pt; }
@media print { .verdict-fail td, .answer-no td, tbody.not-verified td { -webkit-print-color-adjust: exact; print-color-adjust: exact; } }
figure { margin: 2mm 0; break-inside: avoid; }
svg.chart { display: block; max-width: 100%; height: auto; }
ol.closest { margin: 1mm 0 2mm; padding-left: 6mm; }
`;
}

/**
 * The start of a self-contained printable page up to and including <body>: no scripts, fonts
 * or images may load (the content security policy allows only the inline style). The title
 * must already be escaped.
 */
export function pageHead(escapedTitle: string, style: string): string[] {
	return [
		'<!doctype html>',
		'<html lang="en">',
		'<head>',
		'<meta charset="utf-8">',
		`<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'">`,
		'<meta name="viewport" content="width=device-width, initial-scale=1">',
		`<title>${escapedTitle}</title>`,
		`<style>${style}</style>`,
		'</head>',
		'<body>',
	];
}
