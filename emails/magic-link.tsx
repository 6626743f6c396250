import { Button, Link, Text } from "@react-email/components";
import { EmailLayout, emailButton, emailText } from "./_components/layout";

export type Props = { url: string; host: string };

export function MagicLinkEmail({ url, host }: Props) {
  return (
    <EmailLayout preview="Your Ovenward sign-in link" footer="If you did not ask to sign in, ignore this message; nobody can sign in without the link.">
      <Text style={emailText}>Here is your sign-in link for Ovenward at {host}. It works once and expires in 24 hours.</Text>
      <Button href={url} style={emailButton}>
        Sign in to Ovenward
      </Button>
      <Text data-skip-in-text="true" style={{ ...emailText, fontSize: 13, marginTop: 16 }}>
        Or paste this address into your browser: <Link href={url}>{url}</Link>
      </Text>
    </EmailLayout>
  );
}

export const PreviewProps: Props = { url: "http://localhost:3000/api/auth/callback/nodemailer?token=sample", host: "localhost:3000" };
export default MagicLinkEmail;
