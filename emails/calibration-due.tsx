import { Button, Text } from "@react-email/components";
import { EmailLayout, emailButton, emailText } from "./_components/layout";
import { SubscriptionFooter, quiet, sampleLinks, type MailLinks } from "./_components/subscription-footer";

export type Props = {
  instrument: string;
  serial: string;
  dueLabel: string;
  daysLeft: number;
  instrumentUrl: string;
  links: MailLinks;
};

export function CalibrationDueEmail(p: Props) {
  const when = p.daysLeft === 1 ? "tomorrow" : `in ${p.daysLeft} days`;
  return (
    <EmailLayout preview={`${p.instrument}: calibration lapses ${when}`} footer={<SubscriptionFooter what="calibration reminders" links={p.links} />}>
      <Text style={{ ...emailText, fontSize: 20, fontWeight: 700 }}>Calibration due {when}</Text>
      <Text style={emailText}>
        The calibration of {p.instrument} (serial {p.serial}) lapses on {p.dueLabel}. Runs recorded with it after that date will be flagged as
        uncalibrated, so book the calibration before then.
      </Text>
      <Button href={p.instrumentUrl} style={emailButton}>
        Open the instrument
      </Button>
      <Text style={{ ...quiet, marginTop: 16 }}>You are reminded 30 and 7 days before a calibration lapses.</Text>
    </EmailLayout>
  );
}

export const PreviewProps: Props = {
  instrument: "Profiler logger PL-2 with 9 probes",
  serial: "PL2-04417",
  dueLabel: "Thursday 7 January 2027",
  daysLeft: 30,
  instrumentUrl: "http://localhost:3000/instruments/2",
  links: sampleLinks,
};
export default CalibrationDueEmail;
