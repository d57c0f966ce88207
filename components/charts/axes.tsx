import { VictoryLabel } from "victory";

/** Axis styling shared by the library and characterisation charts (tick labels 11 px, axis titles 12 px, dotted grid). */
export const AXIS_STYLE = {
  tickLabels: { fontSize: 11, fill: "#3e4c59" },
  axisLabel: { fontSize: 12, fill: "#1f2933" },
  grid: { stroke: "#d9d4c7", strokeDasharray: "2 4" },
};

/**
 * Chart padding in px: room on top for the value axis's title, on the right for the last tick label's overhang.
 * @example <VictoryChart padding={CHART_PADDING} … />
 */
export const CHART_PADDING = { top: 30, bottom: 48, left: 64, right: 30 };

/**
 * The value axis's title written horizontally above the axis (a long rotated title would be clipped by the chart's
 * height); pass it as a child of VictoryChart.
 * @example <ValueAxisTitle text="DEP velocity (µm/s, + towards stronger field)" />
 */
export function ValueAxisTitle({ text, left = CHART_PADDING.left }: { text: string; left?: number }) {
  return <VictoryLabel x={left - 8} y={12} text={text} textAnchor="start" style={{ fontSize: 12, fill: "#1f2933" }} />;
}
