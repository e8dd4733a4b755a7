import { VegaEmbed } from 'react-vega';
import type { VisualizationSpec } from 'vega-embed';
import { expressionInterpreter } from 'vega-interpreter';
import { chartInk } from '../ui/chart-palette.ts';

/**
 * Tidefield's chart look, applied to every Vega-Lite spec: the app's surface and ink, the
 * app's font at sizes readable from across a control room, quiet grid lines.
 */
const CHART_CONFIG = {
  background: chartInk.background,
  font: 'Atkinson Hyperlegible, system-ui, sans-serif',
  padding: 8,
  view: { stroke: null },
  axis: {
    labelColor: chartInk.mutedText,
    titleColor: chartInk.text,
    domainColor: chartInk.axis,
    tickColor: chartInk.axis,
    gridColor: chartInk.grid,
    labelFontSize: 14,
    titleFontSize: 15,
    titleFontWeight: 700,
  },
  legend: { labelColor: chartInk.text, titleColor: chartInk.text, labelFontSize: 14, titleFontSize: 15, orient: 'bottom' },
  title: { color: chartInk.text, fontSize: 17, anchor: 'start' },
  header: { labelColor: chartInk.text, titleColor: chartInk.text, labelFontSize: 14 },
  text: { color: chartInk.text },
};

export interface VegaChartProps {
  spec: VisualizationSpec;
  /** What the chart shows, for screen readers (the chart itself is an image to them). */
  description: string;
  className?: string;
}

/**
 * A Vega-Lite chart. Expressions run through vega-interpreter, so the app's Content Security
 * Policy can forbid eval; renders SVG so text stays sharp and the chart can be read aloud.
 */
export default function VegaChartImpl({ spec, description, className }: VegaChartProps) {
  const themed = { width: 'container', ...spec, config: { ...CHART_CONFIG, ...(spec as { config?: object }).config } } as VisualizationSpec;
  return (
    <figure className={className} aria-label={description} role="group">
      <VegaEmbed
        spec={themed}
        options={{ actions: false, renderer: 'svg', ast: true, expr: expressionInterpreter, tooltip: { theme: 'dark' } }}
        className="w-full"
      />
      <figcaption className="sr-only">{description}</figcaption>
    </figure>
  );
}
