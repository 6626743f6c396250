"use client";
import { useRouter } from "next/navigation";
import { useCallback, useEffect, useRef, useState } from "react";
import type { RunPreview } from "@/lib/runs/preview";
import { errorOf, parseSetPoints, postForm } from "@/lib/runs/xhr";
import { ProfileChart } from "@/components/runs/profile-chart";
import { Button } from "@/components/ui/button";
import { SelectField, TextAreaField, TextField } from "@/components/ui/field";
import { MappingStep, mappingProblems } from "./mapping-step";
import { ReviewStep } from "./review-step";

type Option = { id: number; label: string };
type Phase = { kind: "idle" } | { kind: "uploading"; fraction: number; what: string } | { kind: "analysing"; what: string } | { kind: "done" };

function localNow(): string {
  const d = new Date();
  d.setMinutes(d.getMinutes() - d.getTimezoneOffset());
  return d.toISOString().slice(0, 16);
}

function Step({ n, title, children, enabled }: { n: number; title: string; children: React.ReactNode; enabled: boolean }) {
  return (
    <section className={`card p-4 ${enabled ? "" : "opacity-60"}`} aria-labelledby={`step-${n}`}>
      <h2 id={`step-${n}`} className="mb-3 flex items-center gap-2 font-semibold">
        <span className="inline-flex h-7 w-7 items-center justify-center rounded-full bg-ink text-sm text-paper">{n}</span>
        {title}
      </h2>
      {children}
    </section>
  );
}

export function UploadWizard({ ovenId, ovenTag, operator, windows, boards, instruments, defaults }: {
  ovenId: number; ovenTag: string; operator: string; windows: Option[]; boards: Option[]; instruments: Option[];
  defaults: { windowId: number | null; boardId: number | null };
}) {
  const router = useRouter();
  const [file, setFile] = useState<File | null>(null);
  const [phase, setPhase] = useState<Phase>({ kind: "idle" });
  const [preview, setPreview] = useState<RunPreview | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [choice, setChoice] = useState({ windowId: defaults.windowId ? String(defaults.windowId) : "", boardId: defaults.boardId ? String(defaults.boardId) : "", instrumentId: "" });
  const [mapping, setMapping] = useState<Record<string, string>>({});
  const [mappingEdited, setMappingEdited] = useState(false);
  const [confirmed, setConfirmed] = useState(false);
  const [serverMappingProblem, setServerMappingProblem] = useState<string | null>(null);
  const [cond, setCond] = useState({ startState: "hot", conveyorSpeed: "", setPoints: "", runAt: localNow(), operator, notes: "" });
  const [saveError, setSaveError] = useState<string | null>(null);
  const [dragging, setDragging] = useState(false);
  const inputRef = useRef<HTMLInputElement>(null);

  const formFor = useCallback((f: File, withMapping: boolean) => {
    const form = new FormData();
    form.set("file", f);
    for (const [k, v] of Object.entries(choice)) if (v) form.set(k, v);
    if (withMapping) form.set("mapping", JSON.stringify(Object.fromEntries(Object.entries(mapping).filter(([, l]) => l))));
    return form;
  }, [choice, mapping]);

  const analyse = useCallback(async (f: File, withMapping: boolean) => {
    setPhase({ kind: "uploading", fraction: 0, what: "Uploading" });
    const { status, body } = await postForm(`/api/v1/ovens/${ovenId}/runs/preview`, formFor(f, withMapping), (fraction) =>
      setPhase(fraction < 1 ? { kind: "uploading", fraction, what: "Uploading" } : { kind: "analysing", what: "Analysing" }),
    );
    setPhase({ kind: "done" });
    if (status !== 200) {
      const e = errorOf(body);
      const field = Object.keys((e.details?.fields as Record<string, string>) ?? {})[0];
      if (field === "mapping" && withMapping) {
        setServerMappingProblem(e.message.replace(/^mapping: /, ""));
        return;
      }
      setPreview(null);
      const where = e.details && typeof e.details.row === "number" ? ` (row ${e.details.row}${e.details.column ? `, column ${e.details.column}` : ""})` : "";
      setFileError(`${e.message}${where}`);
      return;
    }
    const p = body as RunPreview;
    setServerMappingProblem(null);
    setFileError(null);
    setPreview(p);
    if (!withMapping) {
      const proposed: Record<string, string> = {};
      for (const c of p.columns.filter((c) => c.role === "probe")) proposed[c.name] = p.mapping.mapping[c.name] ?? "";
      setMapping(proposed);
      setMappingEdited(false);
      setConfirmed(false);
    }
  }, [ovenId, formFor]);

  // A new file, board or instrument: analyse again and take the remembered or proposed mapping.
  useEffect(() => {
    if (file) void analyse(file, false);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [file, choice.boardId, choice.instrumentId, choice.windowId]);

  // An edited mapping: analyse again with it once the edits settle.
  useEffect(() => {
    if (!file || !mappingEdited || mappingProblems(mapping).length) return;
    const timer = setTimeout(() => void analyse(file, true), 350);
    return () => clearTimeout(timer);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [mapping, mappingEdited]);

  const pick = (files: FileList | null) => {
    const f = files?.[0];
    if (!f) return;
    setPreview(null);
    setFileError(null);
    setFile(f);
  };

  const setPoints = parseSetPoints(cond.setPoints);
  const speed = cond.conveyorSpeed.trim() === "" ? null : Number(cond.conveyorSpeed.replace(",", "."));
  const speedError = speed !== null && !(speed >= 0 && speed <= 1000) ? "a number of cm/min between 0 and 1000" : null;
  const runAtError = !cond.runAt || Number.isNaN(new Date(cond.runAt).getTime()) ? "a date and time" : new Date(cond.runAt).getTime() > Date.now() + 3_600_000 ? "cannot be in the future" : null;
  const mapProblems = preview ? mappingProblems(mapping) : [];
  const needsConfirm = preview?.testBoard && preview.mapping.source === "board-order" && !mappingEdited && !confirmed;
  const busy = phase.kind === "uploading" || phase.kind === "analysing";
  const blockers = [
    !preview ? "Choose a logger file that can be read." : null,
    mapProblems[0] ?? null,
    serverMappingProblem,
    needsConfirm ? "Confirm the column mapping in step 2." : null,
    setPoints.error ? "Fix the set points." : null,
    speedError ? "Fix the conveyor speed." : null,
    runAtError ? "Fix the run time." : null,
  ].filter((x): x is string => Boolean(x));

  const save = async () => {
    if (!file || blockers.length) return;
    setSaveError(null);
    const form = formFor(file, true);
    form.set("startState", cond.startState);
    if (speed !== null) form.set("conveyorSpeed", String(speed));
    if (setPoints.json) form.set("setPoints", setPoints.json);
    form.set("runAt", new Date(cond.runAt).toISOString());
    if (cond.operator) form.set("operator", cond.operator);
    if (cond.notes) form.set("notes", cond.notes);
    setPhase({ kind: "uploading", fraction: 0, what: "Saving" });
    const { status, body } = await postForm(`/api/v1/ovens/${ovenId}/runs`, form, (fraction) => setPhase(fraction < 1 ? { kind: "uploading", fraction, what: "Saving" } : { kind: "analysing", what: "Saving" }));
    if (status === 201) {
      router.push(`/runs/${(body as { id: number }).id}`);
      return;
    }
    setPhase({ kind: "done" });
    setSaveError(errorOf(body).message);
  };

  const series = preview
    ? { time: preview.series.time, probes: preview.series.channels.map((c, i) => ({ key: `p${i}`, label: mapping[c.name] ? `${mapping[c.name]} (${c.name})` : c.name, values: c.values })) }
    : null;

  return (
    <div className="space-y-4">
      <h2 className="text-lg font-semibold">Record a verification run on {ovenTag}</h2>
      <Step n={1} title="Logger file" enabled>
        <div
          onDragOver={(e) => { e.preventDefault(); setDragging(true); }}
          onDragLeave={() => setDragging(false)}
          onDrop={(e) => { e.preventDefault(); setDragging(false); pick(e.dataTransfer.files); }}
          className={`flex flex-col items-center justify-center gap-2 rounded-lg border-2 border-dashed p-6 text-center ${dragging ? "border-ember bg-ember-soft" : "border-paper-line"}`}
        >
          <p className="text-sm text-ink-soft">Drop the logger&apos;s CSV or text export here, or</p>
          <Button type="button" onClick={() => inputRef.current?.click()}>Choose a file</Button>
          <input ref={inputRef} id="logger-file" type="file" accept=".csv,.txt,.tsv,text/csv,text/plain" className="sr-only" aria-label="Logger file" onChange={(e) => pick(e.target.files)} />
          {file ? <p className="text-sm"><span className="font-medium">{file.name}</span> · <span className="num">{(file.size / 1024).toFixed(1)}</span> KB</p> : null}
        </div>
        {busy ? (
          <div className="mt-3" role="status" aria-live="polite">
            <p className="mb-1 text-sm">{phase.kind === "uploading" ? `${phase.what}… ${Math.round(phase.fraction * 100)} %` : `${phase.what}: reading columns and computing the metrics…`}</p>
            <progress className="h-2 w-full accent-ember" max={1} value={phase.kind === "uploading" ? phase.fraction : undefined} aria-label="Upload and analysis progress" />
          </div>
        ) : null}
        {fileError ? <p role="alert" className="mt-3 text-sm text-health-act">{fileError}</p> : null}
        <div className="mt-4 grid gap-3 sm:grid-cols-3">
          <SelectField label="Test board" name="boardId" value={choice.boardId} onChange={(e) => setChoice((c) => ({ ...c, boardId: e.target.value }))}>
            <option value="">no board</option>
            {boards.map((b) => <option key={b.id} value={b.id}>{b.label}</option>)}
          </SelectField>
          <SelectField label="Logger" name="instrumentId" value={choice.instrumentId} onChange={(e) => setChoice((c) => ({ ...c, instrumentId: e.target.value }))} hint="Its scan skew and calibration are applied.">
            <option value="">not recorded</option>
            {instruments.map((i) => <option key={i.id} value={i.id}>{i.label}</option>)}
          </SelectField>
          <SelectField label="Process window" name="windowId" value={choice.windowId} onChange={(e) => setChoice((c) => ({ ...c, windowId: e.target.value }))}>
            <option value="">built-in SAC305 window</option>
            {windows.map((w) => <option key={w.id} value={w.id}>{w.label}</option>)}
          </SelectField>
        </div>
      </Step>
      <Step n={2} title="Columns and probes" enabled={Boolean(preview)}>
        {preview && series ? (
          <div className="grid gap-4 lg:grid-cols-2">
            <MappingStep preview={preview} mapping={mapping} confirmed={confirmed} onConfirm={setConfirmed} serverProblem={serverMappingProblem}
              onChange={(col, label) => { setMapping((m) => ({ ...m, [col]: label })); setMappingEdited(true); }} />
            <div className="min-w-0"><ProfileChart series={series} bands={preview.window.values} phases={null} height={240} compact /></div>
          </div>
        ) : <p className="text-sm text-ink-muted">The detected columns and a preview of the curves appear here once a file is read.</p>}
      </Step>
      <Step n={3} title="Conditions and review" enabled={Boolean(preview)}>
        <div className="grid gap-4 lg:grid-cols-2">
          <div className="grid gap-3 sm:grid-cols-2">
            <fieldset className="sm:col-span-2">
              <legend className="mb-1 text-sm font-medium text-ink-soft">Start</legend>
              <div className="flex gap-2">
                {(["cold", "hot"] as const).map((s) => (
                  <label key={s} className={`flex min-h-11 flex-1 items-center justify-center gap-2 rounded-lg border px-3 text-sm ${cond.startState === s ? "border-ember bg-ember-soft" : "border-paper-line"}`}>
                    <input type="radio" name="startState" value={s} checked={cond.startState === s} onChange={() => setCond((c) => ({ ...c, startState: s }))} />
                    {s === "cold" ? "Cold start" : "Hot start"}
                  </label>
                ))}
              </div>
            </fieldset>
            <TextField label="Run time" name="runAt" type="datetime-local" value={cond.runAt} onChange={(e) => setCond((c) => ({ ...c, runAt: e.target.value }))} error={runAtError ?? undefined} />
            <TextField label="Conveyor speed (cm/min)" name="conveyorSpeed" inputMode="decimal" value={cond.conveyorSpeed} onChange={(e) => setCond((c) => ({ ...c, conveyorSpeed: e.target.value }))} error={speedError ?? undefined} />
            <TextField label="Zone set points (°C)" name="setPoints" placeholder="Z1=120, Z2=150, Z3=165" value={cond.setPoints} onChange={(e) => setCond((c) => ({ ...c, setPoints: e.target.value }))} error={setPoints.error ?? undefined} />
            <TextField label="Operator" name="operator" value={cond.operator} onChange={(e) => setCond((c) => ({ ...c, operator: e.target.value }))} />
            <div className="sm:col-span-2">
              <TextAreaField label="Notes" name="notes" value={cond.notes} onChange={(e) => setCond((c) => ({ ...c, notes: e.target.value }))} />
            </div>
          </div>
          <div>{preview ? <ReviewStep preview={preview} /> : <p className="text-sm text-ink-muted">Metrics and the verdict appear here before you save.</p>}</div>
        </div>
        <div className="mt-4 flex flex-wrap items-center gap-3 border-t border-paper-line pt-4">
          <Button type="button" variant="primary" disabled={blockers.length > 0 || busy} onClick={save}>Save run</Button>
          {blockers.length ? <p className="text-sm text-ink-muted">Save is available once: {blockers.join(" ")}</p> : null}
          {saveError ? <p role="alert" className="text-sm text-health-act">{saveError}</p> : null}
        </div>
      </Step>
    </div>
  );
}
