import { Button, Text } from "@react-email/components";
import { EmailLayout, emailButton, emailText } from "./_components/layout";
import { SubscriptionFooter, headCell, quiet, sampleLinks, sectionTitle, tableCell, type MailLinks } from "./_components/subscription-footer";

// Words and shapes for service states, so the state never rests on colour alone.
const STATE = {
  in_service: { mark: "●", label: "In service", color: "#0f766e" },
  down: { mark: "□", label: "Down", color: "#57534e" },
  retired: { mark: "–", label: "Retired", color: "#78716c" },
} as const;

type Count = { label: string; value: number };
/** A section whose data source may not exist yet: null renders "not tracked yet", never a number. */
type Tracked<T> = { tracked: false; why: string } | ({ tracked: true } & T);

export type Props = {
  recipientName: string;
  siteName: string;
  weekLabel: string;
  ovens: { tag: string; name: string; state: keyof typeof STATE; line: string }[];
  runsOutOfWindow: Tracked<{ items: Count[] }>;
  overdueWork: Tracked<{ items: Count[] }>;
  pmCompliance: Tracked<{ percent: number | null; doneOnTime: number; due: number }>;
  fleetUrl: string;
  links: MailLinks;
};

function NotTracked({ why }: { why: string }) {
  return <Text style={quiet}>Not tracked yet — {why}</Text>;
}

function Counts({ items, empty }: { items: Count[]; empty: string }) {
  if (items.length === 0) return <Text style={quiet}>{empty}</Text>;
  return (
    <table className="mail-data" cellPadding={0} cellSpacing={0} style={{ width: "100%", borderCollapse: "collapse" }}>
      <tbody>
        {items.map((c) => (
          <tr key={c.label}>
            <td style={tableCell}>{c.label}</td>
            <td style={{ ...tableCell, textAlign: "right", fontVariantNumeric: "tabular-nums" }}>{c.value}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export function FleetDigestEmail(p: Props) {
  const counts = (Object.keys(STATE) as (keyof typeof STATE)[]).map((s) => ({ s, n: p.ovens.filter((o) => o.state === s).length }));
  const notInService = p.ovens.filter((o) => o.state !== "in_service");
  return (
    <EmailLayout preview={`${p.siteName}: ${counts[0].n} of ${p.ovens.length} ovens in service`} footer={<SubscriptionFooter what="weekly fleet digest" links={p.links} />}>
      <Text style={{ ...emailText, fontSize: 20, fontWeight: 700 }}>Fleet digest — {p.weekLabel}</Text>
      <Text style={emailText}>
        Good morning {p.recipientName}. Here is {p.siteName} at a glance.
      </Text>
      <Text style={sectionTitle}>Ovens by service state</Text>
      <table className="mail-data" cellPadding={0} cellSpacing={0} style={{ width: "100%", borderCollapse: "collapse" }}>
        <thead>
          <tr>
            <th style={headCell}>State</th>
            <th style={{ ...headCell, textAlign: "right" }}>Ovens</th>
          </tr>
        </thead>
        <tbody>
          {counts.map(({ s, n }) => (
            <tr key={s}>
              <td style={tableCell}>
                <span style={{ color: STATE[s].color }}>{STATE[s].mark}</span> {STATE[s].label}
              </td>
              <td style={{ ...tableCell, textAlign: "right", fontVariantNumeric: "tabular-nums" }}>{n}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {notInService.length ? (
        <Text style={quiet}>Not in service: {notInService.map((o) => `${o.tag} (${STATE[o.state].label.toLowerCase()})`).join(", ")}.</Text>
      ) : (
        <Text style={quiet}>Every oven is in service.</Text>
      )}
      <Text style={sectionTitle}>Runs out of window</Text>
      {p.runsOutOfWindow.tracked ? <Counts items={p.runsOutOfWindow.items} empty="No run fell outside its process window this week." /> : <NotTracked why={p.runsOutOfWindow.why} />}
      <Text style={sectionTitle}>Overdue work</Text>
      {p.overdueWork.tracked ? <Counts items={p.overdueWork.items} empty="No work order is overdue." /> : <NotTracked why={p.overdueWork.why} />}
      <Text style={sectionTitle}>PM compliance</Text>
      {p.pmCompliance.tracked ? (
        <Text style={emailText}>
          {p.pmCompliance.percent === null
            ? "No preventive work was due in the last four weeks."
            : `${p.pmCompliance.percent.toFixed(0)} % — ${p.pmCompliance.doneOnTime} of ${p.pmCompliance.due} preventive work orders done on time in the last four weeks.`}
        </Text>
      ) : (
        <NotTracked why={p.pmCompliance.why} />
      )}
      <Button href={p.fleetUrl} style={{ ...emailButton, marginTop: 12 }}>
        Open the fleet
      </Button>
    </EmailLayout>
  );
}

export const PreviewProps: Props = {
  recipientName: "Declan",
  siteName: "Brightwater Circuits",
  weekLabel: "week of 7 December 2026",
  ovens: [
    { tag: "L1-RF1", name: "Line 1 reflow 1", state: "in_service", line: "SMT Line 1" },
    { tag: "L1-RF2", name: "Line 1 reflow 2", state: "in_service", line: "SMT Line 1" },
    { tag: "L2-RF1", name: "Line 2 reflow 1", state: "in_service", line: "SMT Line 2" },
    { tag: "L2-RF2", name: "Line 2 reflow 2", state: "down", line: "SMT Line 2" },
    { tag: "LAB-B1", name: "Lab batch oven 1", state: "in_service", line: "Prototype lab" },
    { tag: "LAB-B2", name: "Lab batch oven 2", state: "retired", line: "Prototype lab" },
  ],
  runsOutOfWindow: { tracked: false, why: "verification runs are not recorded in Ovenward yet." },
  overdueWork: { tracked: true, items: [{ label: "L2-RF1", value: 1 }, { label: "LAB-B1", value: 2 }] },
  pmCompliance: { tracked: false, why: "maintenance plans are not kept in Ovenward yet." },
  fleetUrl: "http://localhost:3000/fleet",
  links: sampleLinks,
};
export default FleetDigestEmail;
