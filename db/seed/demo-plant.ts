// The invented demo plant of the brief: Brightwater Circuits, one site, two SMT lines and a lab.
export const DEMO_SITE = { name: "Brightwater Circuits — Main plant", timeZone: "Europe/Dublin" };

export const DEMO_LINES = [
  { name: "SMT Line 1", kind: "smt" as const },
  { name: "SMT Line 2", kind: "smt" as const },
  { name: "Prototype lab", kind: "lab" as const },
];

export const DEMO_OVENS = [
  { tag: "L1-RF1", name: "Line 1 reflow, first", line: "SMT Line 1", kind: "convection" as const, zones: 8, maker: "Harrow Thermal", model: "HT-820", serial: "HT820-1147", installedOn: "2021-04-12" },
  { tag: "L1-RF2", name: "Line 1 reflow, second", line: "SMT Line 1", kind: "convection" as const, zones: 8, maker: "Harrow Thermal", model: "HT-820", serial: "HT820-1203", installedOn: "2022-02-07" },
  { tag: "L2-RF1", name: "Line 2 reflow, first", line: "SMT Line 2", kind: "convection" as const, zones: 8, maker: "Harrow Thermal", model: "HT-820N", serial: "HT820N-0311", installedOn: "2020-09-21" },
  { tag: "L2-RF2", name: "Line 2 reflow, second", line: "SMT Line 2", kind: "convection" as const, zones: 8, maker: "Harrow Thermal", model: "HT-820N", serial: "HT820N-0388", installedOn: "2023-05-15" },
  { tag: "LAB-B1", name: "Lab batch oven A", line: "Prototype lab", kind: "batch_ir" as const, zones: 1, maker: "Benchline", model: "IR-Drawer 2", serial: "BL-D2-0072", installedOn: "2019-11-04" },
  { tag: "LAB-B2", name: "Lab batch oven B", line: "Prototype lab", kind: "batch_ir" as const, zones: 1, maker: "Benchline", model: "IR-Drawer 2", serial: "BL-D2-0095", installedOn: "2024-01-22" },
];

export const DEMO_USERS = [
  { email: "admin@brightwater.example", name: "Aoife Byrne", role: "admin" as const },
  { email: "manager@brightwater.example", name: "Declan Moran", role: "manager" as const },
  { email: "engineer@brightwater.example", name: "Priya Nair", role: "engineer" as const },
  { email: "tech@brightwater.example", name: "Tomás Kelly", role: "technician" as const },
  { email: "viewer@brightwater.example", name: "Grace Lynch", role: "viewer" as const },
];
