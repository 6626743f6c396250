import { probeColour } from "@/components/charts/probe-colours";
import { fmt } from "@/lib/runs/format";
import type { RunChannelRow } from "@/db/schema/runs";

export function ProbeTable({ channels, sitsOn }: { channels: RunChannelRow[]; sitsOn: Record<string, string> }) {
  return (
    <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Metrics per probe">
      <table className="w-full min-w-[44rem] text-sm">
        <caption className="sr-only">Metrics per probe</caption>
        <thead className="text-left text-xs text-ink-muted">
          <tr>
            <th scope="col" className="px-2 py-2">Probe</th>
            <th scope="col" className="px-2 py-2 text-right">Peak <span className="unit">°C</span></th>
            <th scope="col" className="px-2 py-2 text-right">at <span className="unit">s</span></th>
            <th scope="col" className="px-2 py-2 text-right">TAL <span className="unit">s</span></th>
            <th scope="col" className="px-2 py-2 text-right">Soak <span className="unit">s</span></th>
            <th scope="col" className="px-2 py-2 text-right">Heat-up <span className="unit">°C/s</span></th>
            <th scope="col" className="px-2 py-2 text-right">Ramp up <span className="unit">°C/s</span></th>
            <th scope="col" className="px-2 py-2 text-right">Ramp down <span className="unit">°C/s</span></th>
            <th scope="col" className="px-2 py-2 text-right">25 °C → peak <span className="unit">s</span></th>
          </tr>
        </thead>
        <tbody className="num">
          {channels.map((c, i) => (
            <tr key={c.id} className="border-t border-paper-line">
              <th scope="row" className="px-2 py-2 text-left font-medium">
                <span className="inline-flex items-center gap-2">
                  <span aria-hidden="true" className="inline-block h-2.5 w-4 rounded-sm" style={{ background: probeColour(i) }} />
                  {c.probeLabel}
                  <span className="font-normal text-ink-muted">{c.column !== c.probeLabel ? c.column : ""}</span>
                </span>
                {sitsOn[c.probeLabel] ? <span className="block text-xs font-normal text-ink-muted">{sitsOn[c.probeLabel]}</span> : null}
              </th>
              <td className="px-2 py-2 text-right">{fmt(c.peak)}</td>
              <td className="px-2 py-2 text-right">{fmt(c.timeAtPeak, 0)}</td>
              <td className="px-2 py-2 text-right">{fmt(c.tal)}</td>
              <td className="px-2 py-2 text-right">{fmt(c.soakTime)}</td>
              <td className="px-2 py-2 text-right">{fmt(c.heatUpRate, 2)}</td>
              <td className="px-2 py-2 text-right">{fmt(c.rampUpMax, 2)}</td>
              <td className="px-2 py-2 text-right">{fmt(c.rampDownMax, 2)}</td>
              <td className="px-2 py-2 text-right">{fmt(c.timeToPeak, 0)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
