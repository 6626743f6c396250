import { Button, Link, Text } from "@react-email/components";
import { CAUTIONS } from "@/lib/maintenance/cautions";
import { EmailLayout, emailButton, emailText } from "./_components/layout";
import { SubscriptionFooter, cautionBox, headCell, sampleLinks, tableCell, type MailLinks } from "./_components/subscription-footer";

export type OverdueOrder = { ovenTag: string; title: string; dueLabel: string; overdueBy: string; assignee: string; url: string };

export type Props = {
  recipientName: string;
  /** As the assignee ("your work") or as the manager told after the grace period ("your team's"). */
  as: "assignee" | "manager";
  orders: OverdueOrder[];
  workOrdersUrl: string;
  links: MailLinks;
};

export function OverdueWorkEmail(p: Props) {
  const n = p.orders.length;
  const whose = p.as === "assignee" ? "assigned to you" : "held by your team";
  return (
    <EmailLayout preview={`${n} overdue work order${n === 1 ? "" : "s"} ${whose}`} footer={<SubscriptionFooter what="overdue work reminders" links={p.links} />}>
      <Text style={{ ...emailText, fontSize: 20, fontWeight: 700 }}>
        {n} overdue work order{n === 1 ? "" : "s"}
      </Text>
      <Text style={emailText}>
        {p.recipientName}, {n === 1 ? "this work order" : "these work orders"} {whose} passed {n === 1 ? "its" : "their"} due time.
        {p.as === "manager" ? " The assignee was reminded first; this note comes after the grace period." : ""}
      </Text>
      <table className="mail-data" cellPadding={0} cellSpacing={0} style={{ width: "100%", borderCollapse: "collapse" }}>
        <thead>
          <tr>
            <th style={headCell}>Oven</th>
            <th style={headCell}>Work order</th>
            <th style={headCell}>Overdue</th>
            {p.as === "manager" ? <th style={headCell}>Assignee</th> : null}
          </tr>
        </thead>
        <tbody>
          {p.orders.map((o) => (
            <tr key={o.url}>
              <td style={{ ...tableCell, fontWeight: 600, whiteSpace: "nowrap" }}>{o.ovenTag}</td>
              <td style={tableCell}>
                <Link href={o.url}>{o.title}</Link>
              </td>
              <td style={{ ...tableCell, color: "#991b1b" }}>
                by {o.overdueBy} (due {o.dueLabel})
              </td>
              {p.as === "manager" ? <td style={tableCell}>{o.assignee}</td> : null}
            </tr>
          ))}
        </tbody>
      </table>
      <Text style={cautionBox}>
        <strong>{CAUTIONS.lockoutTagout.title}.</strong> {CAUTIONS.lockoutTagout.text}
      </Text>
      <Button href={p.workOrdersUrl} style={emailButton}>
        Open the work orders
      </Button>
    </EmailLayout>
  );
}

export const PreviewProps: Props = {
  recipientName: "Declan",
  as: "manager",
  orders: [
    { ovenTag: "L2-RF1", title: "Investigate critical-phase spread rise", dueLabel: "4 Dec 2026, 16:00", overdueBy: "4 days", assignee: "Tomás Kelly", url: "http://localhost:3000/work-orders/41" },
    { ovenTag: "LAB-B1", title: "Replace exhaust filter", dueLabel: "6 Dec 2026, 09:00", overdueBy: "2 days", assignee: "Tomás Kelly", url: "http://localhost:3000/work-orders/39" },
  ],
  workOrdersUrl: "http://localhost:3000/work-orders",
  links: sampleLinks,
};
export default OverdueWorkEmail;
