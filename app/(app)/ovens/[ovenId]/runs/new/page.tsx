import { getDb } from "@/db";
import { loadOvenForPage } from "@/db/queries/oven-page";
import { runChoices } from "@/db/queries/run-options";
import { requirePermission } from "@/lib/session";
import { UploadWizard } from "./upload-wizard";

export const metadata = { title: "Record a run" };

export default async function NewRun({ params }: { params: Promise<{ ovenId: string }> }) {
  const actor = await requirePermission("run.create");
  const { oven } = await loadOvenForPage((await params).ovenId);
  const choices = await runChoices(await getDb());
  return (
    <UploadWizard
      ovenId={oven.id}
      ovenTag={oven.tag}
      operator={actor.name ?? actor.email}
      windows={choices.windows}
      boards={choices.boards.map((b) => ({ id: b.id, label: b.label }))}
      instruments={choices.instruments.filter((i) => i.kind === "logger")}
      defaults={{ windowId: oven.defaultWindowId, boardId: oven.defaultBoardId }}
    />
  );
}
