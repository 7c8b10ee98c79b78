package dev.numafit.report.html;

/**
 * The page's only style sheet, inline. Text is near-black on white (contrast above 15:1); worker
 * segments are dark blue with white labels (above 6:1); hatching and labels, not hue alone, tell
 * the hypervisor's share, DaemonSets, empty channels and overflow apart. System fonts only.
 */
final class Style {
  private Style() {}

  static final String CSS =
      """
      :root { color-scheme: light; }
      body { font-family: system-ui, -apple-system, "Segoe UI", "DejaVu Sans", sans-serif;
        color: #1a1a1a; background: #ffffff; margin: 0; line-height: 1.4; }
      main { max-width: 1000px; margin: 0 auto; padding: 16px 24px 48px; }
      h1 { font-size: 1.6rem; margin: 0.4em 0; }
      h2 { font-size: 1.3rem; border-bottom: 2px solid #1a1a1a; padding-bottom: 2px;
        margin-top: 1.8em; }
      h3 { font-size: 1.1rem; margin-top: 1.4em; }
      .caution { border-left: 6px solid #8a4b00; background: #fff4e0; padding: 8px 12px; }
      table { border-collapse: collapse; margin: 8px 0 16px; font-size: 0.9rem; }
      caption { text-align: left; font-weight: bold; padding: 4px 0; }
      th, td { border: 1px solid #6b6b6b; padding: 3px 8px; text-align: left;
        vertical-align: top; }
      thead th { background: #e8e8e8; }
      td.num { text-align: right; font-variant-numeric: tabular-nums; }
      table.kv th { background: #f3f3f3; font-weight: normal; }
      figure { margin: 8px 0; }
      figcaption { font-size: 0.85rem; color: #333333; }
      svg { max-width: 100%; height: auto; display: block; }
      svg .label { font-family: inherit; font-size: 12px; fill: #1a1a1a; }
      svg .small { font-size: 11px; }
      svg .tiny { font-size: 10px; }
      svg .strong { font-weight: bold; }
      svg .mid { text-anchor: middle; }
      svg .on-dark { fill: #ffffff; }
      svg .boxed { paint-order: stroke; stroke: #ffffff; stroke-width: 3px; }
      svg .socket-box { fill: #f7f7f7; stroke: #1a1a1a; stroke-width: 1.5; }
      svg .node-box { fill: #ffffff; stroke: #4d4d4d; stroke-width: 1; }
      svg .worker-seg { fill: #1f5fa8; stroke: #ffffff; stroke-width: 1; }
      svg .hypervisor { stroke: #4d4d4d; stroke-width: 1; }
      svg .unused { fill: #ffffff; stroke: #6b6b6b; stroke-dasharray: 3 2; }
      svg .channel-box { fill: #f3f3f3; stroke: #4d4d4d; }
      svg .empty-channel .channel-box { stroke: #a11d1d; stroke-width: 2; }
      svg .dimm { fill: #2f6b3a; stroke: #1a1a1a; stroke-width: 0.5; }
      svg .alloc { fill: #ffffff; stroke: #1a1a1a; stroke-width: 1; }
      svg .daemon { stroke: #8a4b00; stroke-width: 0.5; }
      svg .packed { fill: #1f5fa8; }
      svg .series2 { stroke: #1a1a1a; stroke-width: 0.8; }
      svg .over { stroke: #a11d1d; stroke-width: 1; }
      svg .limit { stroke: #1a1a1a; stroke-width: 2; }
      svg .axis { stroke: #1a1a1a; stroke-width: 1; }
      .pair { display: block; }
      .scroll { overflow-x: auto; }
      table.heat td { min-width: 2.2em; text-align: center; }
      table.heat .h0 { background: #ffffff; }
      table.heat .h1 { background: #dbe7f5; }
      table.heat .h2 { background: #a9c4e6; }
      table.heat .h3 { background: #4f7fbf; color: #ffffff; }
      table.heat .h4 { background: #1f3f73; color: #ffffff; font-weight: bold; }
      table.heat .unreachable { background: #1a1a1a; color: #ffffff; }
      nav ul { columns: 2; }
      footer { margin-top: 2em; font-size: 0.85rem; }
      @media print {
        main { max-width: none; padding: 0; }
        section.plan { break-before: page; }
        figure, table { break-inside: avoid; }
        nav { display: none; }
        .scroll { overflow: visible; }
      }
      """;
}
