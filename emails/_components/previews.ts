import type { ComponentType } from "react";
import * as fleetDigest from "../fleet-digest";
import * as myWork from "../my-work";
import * as driftAlert from "../drift-alert";
import * as calibrationDue from "../calibration-due";
import * as overdueWork from "../overdue-work";
import * as magicLink from "../magic-link";
import * as invitation from "../invitation";

type Entry = { component: ComponentType<object>; props: object };
const entry = (m: { default: unknown; PreviewProps: object }): Entry => ({ component: m.default as ComponentType<object>, props: m.PreviewProps });

/** Every template with its sample data, by URL name, for the development preview. */
export const MAIL_PREVIEWS: Record<string, Entry> = {
  "fleet-digest": entry(fleetDigest),
  "my-work": entry(myWork),
  "my-work-empty": { component: myWork.default as ComponentType<object>, props: { ...myWork.PreviewProps, items: [] } },
  "drift-alert": entry(driftAlert),
  "calibration-due": entry(calibrationDue),
  "overdue-work": entry(overdueWork),
  "magic-link": entry(magicLink),
  invitation: entry(invitation),
};
