import { Button, Link, Text } from "@react-email/components";
import { CAUTIONS } from "@/lib/maintenance/cautions";
import { EmailLayout, emailButton, emailText } from "./_components/layout";
import { SubscriptionFooter, cautionBox, headCell, sampleLinks, tableCell, type MailLinks } from "./_components/subscription-footer";

export type MyWorkItem = { ovenTag: string; title: string; dueLabel: string; overdue: boolean; url: string };

export type Props = {
  recipientName: string;
  dateLabel: string;
  /** null when no work-order source is connected yet; [] when there is simply nothing due. */
  items: MyWorkItem[] | null;
  myWorkUrl: string;
  links: MailLinks;
};

export function MyWorkEmail(p: Props) {
  const items = p.items ?? [];
  const overdue = items.filter((i) => i.overdue).length;
  const preview = items.length ? `${items.length} work order${items.length === 1 ? "" : "s"} for you today${overdue ? `, ${overdue} overdue` : ""}` : "Nothing is waiting for you today";
  return (
    <EmailLayout preview={preview} footer={<SubscriptionFooter what="morning list of your work" links={p.links} />}>
      <Text style={{ ...emailText, fontSize: 20, fontWeight: 700 }}>My work — {p.dateLabel}</Text>
      {p.items === null ? (
        <Text style={emailText}>Good morning {p.recipientName}. Work orders are not kept in Ovenward yet, so there is nothing to list for you today.</Text>
      ) : items.length === 0 ? (
        <Text style={emailText}>Good morning {p.recipientName}. Nothing is assigned to you for today, and nothing of yours is overdue.</Text>
      ) : (
        <>
          <Text style={emailText}>
            Good morning {p.recipientName}. {preview}; overdue work comes first.
          </Text>
          <table className="mail-data" cellPadding={0} cellSpacing={0} style={{ width: "100%", borderCollapse: "collapse" }}>
            <thead>
              <tr>
                <th style={headCell}>Oven</th>
                <th style={headCell}>Task</th>
                <th style={headCell}>Due</th>
              </tr>
            </thead>
            <tbody>
              {[...items].sort((a, b) => Number(b.overdue) - Number(a.overdue)).map((i) => (
                <tr key={i.url}>
                  <td style={{ ...tableCell, fontWeight: 600, whiteSpace: "nowrap" }}>{i.ovenTag}</td>
                  <td style={tableCell}>
                    <Link href={i.url}>{i.title}</Link>
                  </td>
                  <td style={{ ...tableCell, color: i.overdue ? "#991b1b" : undefined }}>{i.overdue ? `Overdue — ${i.dueLabel}` : i.dueLabel}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <Text style={cautionBox}>
            <strong>{CAUTIONS.lockoutTagout.title}.</strong> {CAUTIONS.lockoutTagout.text}
          </Text>
        </>
      )}
      <Button href={p.myWorkUrl} style={{ ...emailButton, marginTop: 8 }}>
        Open My work
      </Button>
    </EmailLayout>
  );
}

export const PreviewProps: Props = {
  recipientName: "Tomás",
  dateLabel: "Tuesday 8 December 2026",
  items: [
    { ovenTag: "L2-RF1", title: "Investigate critical-phase spread rise", dueLabel: "Fri 4 Dec, 16:00", overdue: true, url: "http://localhost:3000/work-orders/41" },
    { ovenTag: "L1-RF1", title: "Clean flux from chamber and exhaust", dueLabel: "today, 10:00", overdue: false, url: "http://localhost:3000/work-orders/44" },
    { ovenTag: "LAB-B1", title: "Lubricate drawer runners", dueLabel: "today, 14:00", overdue: false, url: "http://localhost:3000/work-orders/45" },
  ],
  myWorkUrl: "http://localhost:3000/my-work",
  links: sampleLinks,
};
export default MyWorkEmail;
