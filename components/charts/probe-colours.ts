/**
 * Probe colours in a fixed order, so TC1 (the first probe) has the same colour on every chart and
 * on the board map. Paul Tol's "muted" qualitative scheme (designed to stay distinct for the common
 * colour-vision deficiencies), then three of his "bright" colours for boards with more probes.
 * Past twelve probes the colours repeat with a dash pattern, so lines are never told apart by colour alone.
 */
export const PROBE_COLOURS = [
  "#332288", "#88CCEE", "#44AA99", "#117733", "#999933", "#DDCC77",
  "#CC6677", "#882255", "#AA4499", "#4477AA", "#EE6677", "#777777",
] as const;

const DASHES = ["", "6 3", "2 2", "8 3 2 3"];

export function probeColour(index: number): string {
  return PROBE_COLOURS[index % PROBE_COLOURS.length];
}

export function probeDash(index: number): string | undefined {
  return DASHES[Math.floor(index / PROBE_COLOURS.length) % DASHES.length] || undefined;
}
