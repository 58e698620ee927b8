/**
 * Print rules for the web sheet: no site chrome, paper white, tables kept
 * whole where they fit, charts never split, links show nothing extra.
 */
const css = `
@media print {
  @page { size: A4; margin: 16mm 14mm 18mm; }
  html, body { background: #fff !important; }
  header[data-site], footer[data-site], nav, .sheet-no-print { display: none !important; }
  .sheet-view { max-width: none !important; padding: 0 !important; font-size: 9.5pt; }
  .sheet-view section { break-inside: auto; }
  .sheet-view h2 { break-after: avoid; }
  .sheet-view figure, .sheet-view tr, .sheet-view .sheet-keep { break-inside: avoid; }
  .sheet-view thead { display: table-header-group; }
  .sheet-view .sheet-table tbody tr:hover > * { background: none; }
  .sheet-view .sheet-banner { border-width: 1.5pt; }
  .sheet-view .sheet-withdrawn { border-width: 2pt; }
  .sheet-view details { display: block; }
  .sheet-view details > summary { list-style: none; }
}
`;

export function SheetPrintStyle() {
  return <style>{css}</style>;
}
