import { Body, Container, Head, Hr, Html, Preview, Section, Text } from "@react-email/components";
import type { ReactNode } from "react";

const ink = "#1c2126";
const muted = "#5b636b";

export function EmailLayout({ preview, children, footer }: { preview: string; children: ReactNode; footer?: ReactNode }) {
  return (
    <Html lang="en">
      <Head />
      <Preview>{preview}</Preview>
      <Body style={{ backgroundColor: "#faf7f2", fontFamily: "'IBM Plex Sans', Helvetica, Arial, sans-serif", color: ink, margin: 0 }}>
        <Container style={{ maxWidth: 560, margin: "24px auto", backgroundColor: "#ffffff", border: "1px solid #e2dbd0", borderRadius: 10, padding: "24px 28px" }}>
          <Text style={{ fontSize: 18, fontWeight: 700, margin: "0 0 16px", letterSpacing: "0.02em" }}>
            <span style={{ color: "#c2410c" }}>▲</span> Ovenward
          </Text>
          <Section>{children}</Section>
          <Hr style={{ borderColor: "#e2dbd0", margin: "24px 0 12px" }} />
          <Text style={{ fontSize: 12, color: muted, margin: 0 }}>
            {footer ?? "You receive this because you have an Ovenward account at your plant."}
          </Text>
        </Container>
      </Body>
    </Html>
  );
}

export const emailText = { fontSize: 15, lineHeight: "22px", margin: "0 0 12px" } as const;
export const emailButton = {
  backgroundColor: "#c2410c",
  color: "#ffffff",
  padding: "12px 20px",
  borderRadius: 8,
  fontWeight: 600,
  textDecoration: "none",
  display: "inline-block",
} as const;
