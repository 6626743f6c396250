import { Button, Link, Text } from "@react-email/components";
import { EmailLayout, emailButton, emailText } from "./_components/layout";

export type Props = { url: string; invitedBy: string; role: string; plant: string };

export function InvitationEmail({ url, invitedBy, role, plant }: Props) {
  return (
    <EmailLayout preview={`${invitedBy} invited you to Ovenward`}>
      <Text style={emailText}>
        {invitedBy} has given you an Ovenward account at {plant} with the {role} role. Choose a password to start; the link
        works for seven days.
      </Text>
      <Button href={url} style={emailButton}>
        Choose a password
      </Button>
      <Text data-skip-in-text="true" style={{ ...emailText, fontSize: 13, marginTop: 16 }}>
        Or paste this address into your browser: <Link href={url}>{url}</Link>
      </Text>
    </EmailLayout>
  );
}

export const PreviewProps: Props = { url: "http://localhost:3000/invite/sample", invitedBy: "admin@brightwater.example", role: "technician", plant: "Brightwater Circuits" };
export default InvitationEmail;
