import { Button, Text } from "@react-email/components";
import { CAUTIONS } from "@/lib/maintenance/cautions";
import { EmailLayout, emailButton, emailText } from "./_components/layout";
import { SubscriptionFooter, quiet, sampleLinks, type MailLinks } from "./_components/subscription-footer";

export type Props = {
  ovenTag: string;
  ovenName: string;
  /** Health after the alert: Watch (triangle) or Act (diamond). */
  health: "watch" | "act";
  metric: string;
  /** The reason in plain words, e.g. "critical spread rising; projected to reach 8 °C in about 19 days". */
  reason: string;
  /** The statistics behind it, for whoever wants them. */
  details: string;
  detectedLabel: string;
  alertUrl: string;
  links: MailLinks;
};

const HEALTH = { watch: { mark: "▲", word: "Watch", color: "#b45309" }, act: { mark: "◆", word: "Act", color: "#991b1b" } } as const;

export function DriftAlertEmail(p: Props) {
  const h = HEALTH[p.health];
  return (
    <EmailLayout preview={`${p.ovenTag}: ${h.word} — ${p.reason}`} footer={<SubscriptionFooter what="drift alerts" links={p.links} />}>
      <Text style={{ ...emailText, fontSize: 20, fontWeight: 700 }}>
        <span style={{ color: h.color }}>{h.mark}</span> {p.ovenTag} is now {h.word}
      </Text>
      <Text style={emailText}>
        {p.ovenName}: {p.metric} — {p.reason}.
      </Text>
      <Text style={quiet}>{p.details}</Text>
      <Text style={quiet}>Detected {p.detectedLabel}.</Text>
      <Button href={p.alertUrl} style={emailButton}>
        Look at the alert
      </Button>
      <Text style={{ ...quiet, marginTop: 16 }}>{CAUTIONS.verdicts.text}</Text>
    </EmailLayout>
  );
}

export const PreviewProps: Props = {
  ovenTag: "L2-RF1",
  ovenName: "Line 2 reflow 1",
  health: "watch",
  metric: "critical-phase spread",
  reason: "rising for 9 runs; projected to reach 8 °C in about 19 days",
  details: "EWMA (λ = 0.2) 6.1 °C above its upper limit 5.9 °C; Theil–Sen slope +0.04 °C per day.",
  detectedLabel: "8 Dec 2026, 09:12 GMT",
  alertUrl: "http://localhost:3000/alerts/12",
  links: sampleLinks,
};
export default DriftAlertEmail;
