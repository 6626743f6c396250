import Link from "next/link";
import QRCode from "qrcode";
import { buttonClass } from "@/components/ui/button";
import { loadOvenForPage } from "@/db/queries/oven-page";
import { OvenwardMark } from "@/components/brand/logo";
import { requirePermission } from "@/lib/session";
import { appUrl } from "@/lib/env";
import { PrintButton } from "./print-button";

export const metadata = { title: "QR label" };

// A label to stick on the oven: scanning it on a phone opens the oven's page.
export default async function OvenLabel({ params }: { params: Promise<{ ovenId: string }> }) {
  await requirePermission("oven.read");
  const { oven, line } = await loadOvenForPage((await params).ovenId);
  const url = `${appUrl()}/ovens/${oven.id}`;
  const svg = await QRCode.toString(url, { type: "svg", errorCorrectionLevel: "M", margin: 1, color: { dark: "#1c2126", light: "#ffffff" } });
  return (
    <main className="flex min-h-dvh flex-col items-center justify-center gap-6 bg-white p-6">
      <div className="w-[62mm] rounded-lg border-2 border-ink p-3 text-center print:rounded-none">
        <div className="mx-auto w-[48mm]" role="img" aria-label={`QR code for ${url}`} dangerouslySetInnerHTML={{ __html: svg }} />
        <p className="mt-2 text-2xl font-bold tracking-wider">{oven.tag}</p>
        <p className="text-xs text-ink-soft">{oven.name} · {line.name}</p>
        <p className="mt-1 flex items-center justify-center gap-1 text-[10px] text-ink-muted">
          <OvenwardMark size={14} /> Scan to open in Ovenward
        </p>
      </div>
      <p className="no-print max-w-sm text-center text-sm text-ink-muted">
        Print at 100 % on a label or plain paper. The code opens <span className="whitespace-nowrap">{url}</span>; signing in is still
        required.
      </p>
      <div className="no-print flex gap-3">
        <PrintButton />
        <Link href={`/ovens/${oven.id}/setup`} className={buttonClass("secondary")}>
          Back to {oven.tag}
        </Link>
      </div>
    </main>
  );
}
