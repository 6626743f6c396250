import { Link } from "@react-email/components";

export type MailLinks = { settings: string; unsubscribe: string };

const link = { color: "#5b636b", textDecoration: "underline" } as const;

/** The footer every subscribed message carries: why it came, where to change it, how to stop it. */
export function SubscriptionFooter({ what, links }: { what: string; links: MailLinks }) {
  return (
    <>
      You get the {what} because of your e-mail settings in Ovenward. <Link href={links.settings} style={link}>Change what you receive</Link> ·{" "}
      <Link href={links.unsubscribe} style={link}>Stop the {what}</Link>
    </>
  );
}

export const sampleLinks: MailLinks = {
  settings: "http://localhost:3000/settings/notifications",
  unsubscribe: "http://localhost:3000/unsubscribe?token=sample",
};

export const tableCell = { padding: "6px 8px", borderBottom: "1px solid #eee7dc", fontSize: 14, textAlign: "left" as const, verticalAlign: "top" as const };
export const headCell = { ...tableCell, fontSize: 12, color: "#5b636b", fontWeight: 600 };
export const sectionTitle = { fontSize: 16, fontWeight: 700, margin: "20px 0 6px" } as const;
export const quiet = { fontSize: 14, color: "#5b636b", margin: "0 0 8px" } as const;
export const cautionBox = { fontSize: 13, lineHeight: "19px", backgroundColor: "#fff7ed", border: "1px solid #fdba74", borderRadius: 8, padding: "10px 12px", margin: "12px 0" } as const;
