import { AppShell } from "@/components/shell/app-shell";
import { requireUser } from "@/lib/session";
import { Providers } from "./providers";

export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const actor = await requireUser();
  return (
    <AppShell actor={actor}>
      <Providers>{children}</Providers>
    </AppShell>
  );
}
