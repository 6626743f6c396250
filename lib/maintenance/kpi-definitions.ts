/*
 * The KPI definitions as shown on the fleet and oven pages. They state exactly what kpis.ts
 * computes; change both together.
 */

export const KPI_DEFINITIONS = {
  pmCompliance:
    "PM compliance: of the preventive work orders due in the period, the share done by their due " +
    "time. Cancelled orders are left out of both counts (a cancelled order was not owed work). " +
    "Orders falling due after now are not counted yet, so a period still running is not " +
    "penalised for work that is not due. An order that is still open after its due time counts " +
    "as not done on time.",
  mtbf:
    "MTBF (mean time between failures): the oven's operating time in the period minus its " +
    "breakdown downtime in the period, divided by the number of breakdowns that started in the " +
    "period. A breakdown is a corrective work order marked as a breakdown. Operating time is the " +
    "whole period unless planned production hours are given. With no breakdowns, MTBF is not " +
    "defined and is shown as none. For the fleet: the ovens' operating time minus downtime, " +
    "added up, divided by all their breakdowns.",
  mttr:
    "MTTR (mean time to repair): the recorded downtime of the breakdowns that started in the " +
    "period and have been repaired (work order done), divided by their number. A repair still " +
    "under way has no repair time yet and is left out. When no downtime was recorded on a done " +
    "breakdown, the time from the failure to the close is used.",
  availability:
    "Availability: the period's minutes minus breakdown downtime minutes in the period, divided " +
    "by the period's minutes. Downtime is the part of each breakdown (from the failure, for its " +
    "recorded downtime, or until now while the repair is under way) that lies inside the period. " +
    "Planned maintenance stops are not counted as downtime here: they are scheduled into the " +
    "production plan.",
  backlogAge:
    "Backlog age: unfinished work orders (open, in progress or on hold) at this moment, grouped " +
    "by how long they have been waiting, in whole days: 0–7, 8–30, 31–90 and over 90. A scheduled " +
    "order waits from its due time (orders generated ahead are not backlog until due); an order " +
    "without a due time waits from when it was raised.",
} as const;

export type KpiName = keyof typeof KPI_DEFINITIONS;
