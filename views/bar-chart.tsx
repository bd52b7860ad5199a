/** @jsxImportSource hono/jsx */
/**
 * A horizontal bar chart drawn on the server as SVG: a title and a text alternative for screen
 * readers, and the same numbers in a table beside it. Values are shares from 0 to 1 (or null);
 * an optional reference line marks "no bias" or a published figure.
 */
export function BarChart(props: { title: string; description: string; bars: { label: string; value: number | null; note?: string }[]; reference?: { at: number; label: string } }) {
  const rowHeight = 22;
  const labelWidth = 220;
  const barWidth = 300;
  const height = props.bars.length * rowHeight + 30;
  const id = props.title.toLowerCase().replace(/[^a-z0-9]+/g, '-');
  const pct = (v: number | null) => (v === null ? 'n/a' : `${(v * 100).toFixed(1)}%`);
  return (
    <figure class="chart">
      <figcaption>{props.title}</figcaption>
      <svg role="img" aria-labelledby={`${id}-title ${id}-desc`} viewBox={`0 0 ${labelWidth + barWidth + 70} ${height}`} width="100%" height={height}>
        <title id={`${id}-title`}>{props.title}</title>
        <desc id={`${id}-desc`}>{`${props.description} ${props.bars.map((b) => `${b.label}: ${pct(b.value)}`).join('; ')}.`}</desc>
        {props.bars.map((b, i) => (
          <g>
            <text x={labelWidth - 6} y={i * rowHeight + 15} text-anchor="end" font-size="12" fill="#1d232b">{b.label}</text>
            <rect x={labelWidth} y={i * rowHeight + 4} width={barWidth * Math.max(0, Math.min(1, b.value ?? 0))} height={rowHeight - 8} fill="#2f5d7c" />
            <text x={labelWidth + barWidth * Math.max(0, Math.min(1, b.value ?? 0)) + 4} y={i * rowHeight + 15} font-size="12" fill="#1d232b">{pct(b.value)}</text>
          </g>
        ))}
        {props.reference && (
          <g>
            <line x1={labelWidth + barWidth * props.reference.at} x2={labelWidth + barWidth * props.reference.at} y1={0} y2={height - 22} stroke="#b35c00" stroke-dasharray="4 3" />
            <text x={labelWidth + barWidth * props.reference.at} y={height - 8} font-size="11" text-anchor="middle" fill="#5b6572">{props.reference.label}</text>
          </g>
        )}
      </svg>
      <table class="chart-numbers">
        <caption>{`${props.title} — the numbers`}</caption>
        <thead><tr><th scope="col">Measure</th><th scope="col">Value</th><th scope="col">Note</th></tr></thead>
        <tbody>{props.bars.map((b) => <tr><td>{b.label}</td><td>{pct(b.value)}</td><td>{b.note ?? ''}</td></tr>)}</tbody>
      </table>
    </figure>
  );
}
