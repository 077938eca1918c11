// The position layouts of the two invented aircraft types, generated from a few families.
// Map units: x 0..1000 from nose to tail, y 0..600 across the span (300 is the centreline).

export interface DemoPosition {
  code: string;
  label: string;
  parentCode: string | null;
  ata: string;
  x: number;
  y: number;
  zone: string;
  cautions: string[];
  independentInspection: boolean;
  eligible: string[]; // part-number keys
}

export interface DemoType {
  id: number;
  code: string;
  name: string;
  brakeActuatorsPerBrake: number;
  engines: "turbofan" | "turboprop";
}

export const DEMO_TYPES: DemoType[] = [
  { id: 1, code: "QL-72", name: "Ferrule 72", brakeActuatorsPerBrake: 4, engines: "turbofan" },
  { id: 2, code: "QL-40", name: "Ferrule 40", brakeActuatorsPerBrake: 3, engines: "turboprop" },
];

// Cautions shown before work; reminders only — the maintenance manual governs.
const GEAR_CAUTIONS = [
  "Install the landing-gear ground-lock pins on all gear before starting (AMM warning for wheel and brake tasks).",
  "Chock the tyres; remove one wheel at a time per main gear.",
];
const WHEEL_CAUTIONS = [
  ...GEAR_CAUTIONS,
  "Let hot brakes and wheels cool; approach from fore or aft, never in line with the axle.",
  "Fully deflate the tyre before removing a wheel and tyre assembly; inflate only in a safety cage.",
];
const BRAKE_ACTUATOR_CAUTIONS = [
  ...GEAR_CAUTIONS,
  "Let hot brakes cool before touching the actuators.",
  "Open, collar and tag the brake actuator circuit breakers; beware stored energy in the actuator.",
  "Handle the actuator connector per ESD practice; fit a new seal and torque per the maintenance manual.",
];
const FLIGHT_CONTROL_CAUTIONS = [
  "Depressurise the hydraulic system and accumulators before work.",
  "Clear the control surface travel area; tag the flight deck controls.",
  "An independent inspection of the connection and rigging is required before return to service.",
];
const ENGINE_CAUTIONS = [
  "Make sure the engine is shut down and cool; pull and tag the ignition and start circuit breakers.",
];
const ELECTRICAL_CAUTIONS = ["Remove electrical power and tag the breakers before disconnecting."];

export function buildLayout(type: DemoType): DemoPosition[] {
  const positions: DemoPosition[] = [];
  const add = (p: Omit<DemoPosition, "cautions" | "independentInspection" | "parentCode"> & Partial<DemoPosition>) =>
    positions.push({ parentCode: null, cautions: [], independentInspection: false, ...p });

  // Main landing gear: two sides, two wheels each, an electric brake per wheel with several actuators
  // spaced round it. Each wheel is a row: speed transducer, wheel, temperature sensor, brake, actuators.
  const sides = [
    { side: "L", rows: [150, 230], zone: "MLG-L", wheels: [1, 2], strutY: 190 },
    { side: "R", rows: [370, 450], zone: "MLG-R", wheels: [3, 4], strutY: 410 },
  ];
  for (const { side, rows, zone, wheels, strutY } of sides) {
    const gear = `MLG-${side}`;
    const sideWord = side === "L" ? "left" : "right";
    add({ code: `${gear}-STRUT`, label: `Main gear shock strut, ${sideWord}`, ata: "32-11", x: 700, y: strutY, zone, cautions: GEAR_CAUTIONS, eligible: ["mlgStrut"] });
    add({ code: `${gear}-RA`, label: `Main gear retraction actuator, ${sideWord}`, ata: "32-31", x: 740, y: strutY - 24, zone, cautions: GEAR_CAUTIONS, independentInspection: true, eligible: ["mlgRetract"], parentCode: `${gear}-STRUT` });
    add({ code: `${gear}-UL`, label: `Main gear uplock actuator, ${sideWord}`, ata: "32-32", x: 740, y: strutY + 24, zone, cautions: GEAR_CAUTIONS, eligible: ["uplock"], parentCode: `${gear}-STRUT` });
    wheels.forEach((n, i) => {
      const wy = rows[i];
      const wheel = `W${n}`;
      const brake = `B${n}`;
      add({ code: `${brake}-WST`, label: `Wheel speed transducer, wheel ${n}`, ata: "32-42", x: 470, y: wy, zone, cautions: WHEEL_CAUTIONS, eligible: ["wheelSpeed"], parentCode: wheel });
      add({ code: wheel, label: `Main wheel ${n}`, ata: "32-41", x: 505, y: wy, zone, cautions: WHEEL_CAUTIONS, eligible: ["mainWheel", "mainWheelB"], parentCode: `${gear}-STRUT` });
      add({ code: `${brake}-BTS`, label: `Brake temperature sensor, brake ${n}`, ata: "32-42", x: 540, y: wy, zone, cautions: WHEEL_CAUTIONS, eligible: ["brakeTemp"], parentCode: brake });
      add({ code: brake, label: `Brake ${n}`, ata: "32-42", x: 575, y: wy, zone, cautions: WHEEL_CAUTIONS, eligible: ["brake", "brakeB"], parentCode: wheel });
      const count = type.brakeActuatorsPerBrake;
      for (let a = 1; a <= count; a++) {
        const angle = (2 * Math.PI * (a - 1)) / count - Math.PI / 2;
        add({
          code: `${brake}-EBA${a}`,
          label: `Brake ${n} electric actuator ${a}`,
          ata: "32-42",
          x: round(636 + 26 * Math.cos(angle)),
          y: round(wy + 26 * Math.sin(angle)),
          zone,
          cautions: BRAKE_ACTUATOR_CAUTIONS,
          eligible: ["brakeActuator", "brakeActuatorB"],
          parentCode: brake,
        });
      }
    });
  }

  // Nose landing gear.
  add({ code: "NLG-STRUT", label: "Nose gear shock strut", ata: "32-21", x: 230, y: 300, zone: "NLG", cautions: GEAR_CAUTIONS, eligible: ["nlgStrut"] });
  add({ code: "NLG-RA", label: "Nose gear retraction actuator", ata: "32-31", x: 262, y: 300, zone: "NLG", cautions: GEAR_CAUTIONS, independentInspection: true, eligible: ["nlgRetract"], parentCode: "NLG-STRUT" });
  add({ code: "NLG-STEER", label: "Nose wheel steering actuator", ata: "32-51", x: 230, y: 332, zone: "NLG", cautions: GEAR_CAUTIONS, independentInspection: true, eligible: ["steering"], parentCode: "NLG-STRUT" });
  add({ code: "NW1", label: "Nose wheel 1 (left)", ata: "32-41", x: 198, y: 284, zone: "NLG", cautions: WHEEL_CAUTIONS, eligible: ["noseWheel"], parentCode: "NLG-STRUT" });
  add({ code: "NW2", label: "Nose wheel 2 (right)", ata: "32-41", x: 198, y: 316, zone: "NLG", cautions: WHEEL_CAUTIONS, eligible: ["noseWheel"], parentCode: "NLG-STRUT" });

  // Avionics bay, laid out as racks.
  const avionics: Array<[string, string, string, number]> = [
    ["ADIRU", "Air data inertial reference unit", "adiru", 3],
    ["WXR", "Weather radar transceiver", "weatherRadar", 1],
    ["RADALT", "Radio altimeter transceiver", "radioAltimeter", 2],
    ["XPDR", "ATC transponder", "transponder", 2],
    ["DME", "DME interrogator", "dme", 2],
    ["VHFNAV", "VHF navigation receiver", "vhfNav", 2],
    ["VHFCOM", "VHF communication transceiver", "vhfCom", 3],
    ["FDR", "Flight data recorder", "fdr", 1],
    ["CVR", "Cockpit voice recorder", "cvr", 1],
    ["CMC", "Central maintenance computer", "maintComputer", 1],
    ["FCC", "Flight control computer", "fcc", 2],
  ];
  let rack = 0;
  for (const [code, label, key, count] of avionics) {
    for (let n = 1; n <= count; n++) {
      add({ code: count > 1 ? `${code}-${n}` : code, label: count > 1 ? `${label} ${n}` : label, ata: ataOf(key), x: 60 + (rack % 4) * 32, y: 400 + Math.floor(rack / 4) * 32, zone: "AVIONICS", cautions: ELECTRICAL_CAUTIONS, eligible: [key] });
      rack++;
    }
  }
  for (let n = 1; n <= 6; n++) {
    add({ code: `DU-${n}`, label: `Flight deck display unit ${n}`, ata: "31-61", x: 60 + ((n - 1) % 3) * 32, y: 80 + Math.floor((n - 1) / 3) * 32, zone: "FLIGHT DECK", cautions: ELECTRICAL_CAUTIONS, eligible: ["display", "displayB"] });
  }

  // Engine accessories, one set per engine on the wings.
  const engineParts: Array<[string, string, string]> = [
    ["FP", "Engine fuel pump", "fuelPump"],
    ["FMU", "Fuel metering unit", "fmu"],
    ["STARTER", type.engines === "turbofan" ? "Air turbine starter" : "Starter", "starter"],
    ["GEN", "AC generator", "generator"],
    ["HYDP", "Engine-driven hydraulic pump", "hydPump"],
    ["IGN-A", "Ignition exciter A", "exciter"],
    ["IGN-B", "Ignition exciter B", "exciter"],
    ["OILP", "Oil pressure transmitter", "oilPressure"],
    ["EGT", "EGT thermocouple harness", "egtHarness"],
  ];
  if (type.engines === "turboprop") {
    engineParts.push(["PCU", "Propeller control unit", "propControl"], ["OSG", "Propeller overspeed governor", "overspeedGov"], ["DEICE-T", "Propeller de-ice timer", "deiceTimer"]);
  }
  for (const engine of [1, 2]) {
    engineParts.forEach(([code, label, key], i) => {
      const starterEligible = key === "starter" ? ["starter", "starterB"] : [key];
      add({ code: `E${engine}-${code}`, label: `${label}, engine ${engine}`, ata: ataOf(key), x: 415 + (i % 4) * 30, y: engine === 1 ? 50 + Math.floor(i / 4) * 30 : 550 - Math.floor(i / 4) * 30, zone: `ENGINE ${engine}`, cautions: ENGINE_CAUTIONS, eligible: starterEligible });
    });
  }

  // Flight control actuators along the wings and tail.
  const fc = (code: string, label: string, key: string, x: number, y: number, zone: string) =>
    add({ code, label, ata: ataOf(key), x, y, zone, cautions: FLIGHT_CONTROL_CAUTIONS, independentInspection: true, eligible: [key] });
  const aileronsPerSide = type.engines === "turbofan" ? 2 : 1;
  for (let n = 1; n <= aileronsPerSide; n++) {
    fc(`AIL-L-${n}`, `Aileron actuator, left ${n}`, "aileronActuator", 664 + n * 26, 22, "LEFT WING");
    fc(`AIL-R-${n}`, `Aileron actuator, right ${n}`, "aileronActuator", 664 + n * 26, 578, "RIGHT WING");
  }
  const spoilersPerSide = type.engines === "turbofan" ? 5 : 4;
  for (let n = 1; n <= spoilersPerSide; n++) {
    fc(`SPL-L-${n}`, `Spoiler actuator, left ${n}`, "spoilerActuator", 560 + n * 24, 110 - n * 14, "LEFT WING");
    fc(`SPL-R-${n}`, `Spoiler actuator, right ${n}`, "spoilerActuator", 560 + n * 24, 490 + n * 14, "RIGHT WING");
  }
  for (let n = 1; n <= 2; n++) {
    fc(`FLAP-L-${n}`, `Flap actuator, left ${n}`, "flapActuator", 556, 118 - (n - 1) * 46, "LEFT WING");
    fc(`FLAP-R-${n}`, `Flap actuator, right ${n}`, "flapActuator", 556, 482 + (n - 1) * 46, "RIGHT WING");
  }
  const elevatorsPerSide = type.engines === "turbofan" ? 2 : 1;
  for (let n = 1; n <= elevatorsPerSide; n++) {
    fc(`ELEV-L-${n}`, `Elevator actuator, left ${n}`, "elevatorActuator", 930, 240 - n * 30, "TAIL");
    fc(`ELEV-R-${n}`, `Elevator actuator, right ${n}`, "elevatorActuator", 930, 360 + n * 30, "TAIL");
  }
  const rudders = type.engines === "turbofan" ? 3 : 2;
  for (let n = 1; n <= rudders; n++) fc(`RUD-${n}`, `Rudder actuator ${n}`, "rudderActuator", 905 + n * 28, 300, "TAIL");

  // Electrical, air and ice protection in the centre fuselage.
  const centre: Array<[string, string, string, number]> = [
    ["BAT", "Main battery", "battery", 2],
    ["TRU", "Transformer rectifier unit", "tru", 3],
    ["GCU", "Generator control unit", "gcu", 2],
    ["PACK", "Pack flow control valve", "packValve", 2],
    ["CPC", "Cabin pressure controller", "cpc", 2],
    ["BLEED", "Bleed pressure regulating valve", "bleedValve", 2],
  ];
  if (type.engines === "turboprop") centre.push(["DEICE-V", "Airframe de-ice valve", "deiceValve", 4]);
  let slot = 0;
  for (const [code, label, key, count] of centre) {
    for (let n = 1; n <= count; n++) {
      add({ code: `${code}-${n}`, label: `${label} ${n}`, ata: ataOf(key), x: 300 + (slot % 6) * 30, y: 270 + Math.floor(slot / 6) * 30, zone: "CENTRE", cautions: key === "battery" || key === "tru" || key === "gcu" ? ELECTRICAL_CAUTIONS : [], eligible: [key] });
      slot++;
    }
  }
  if (type.engines === "turbofan") {
    add({ code: "APU-SG", label: "APU starter-generator", ata: "49-42", x: 960, y: 340, zone: "TAIL", cautions: ELECTRICAL_CAUTIONS, eligible: ["apuStarterGen"] });
  }
  return positions;
}

const ATA: Record<string, string> = {
  adiru: "34-12", weatherRadar: "34-41", radioAltimeter: "34-33", transponder: "34-52", dme: "34-51", vhfNav: "34-55",
  vhfCom: "23-12", fdr: "31-31", cvr: "23-71", maintComputer: "45-10", fcc: "22-11", fuelPump: "73-11", fmu: "73-21",
  starter: "80-11", generator: "24-21", hydPump: "29-11", exciter: "74-11", oilPressure: "79-31", egtHarness: "77-21",
  propControl: "61-21", overspeedGov: "61-22", deiceTimer: "30-11", aileronActuator: "27-11", spoilerActuator: "27-61",
  flapActuator: "27-51", elevatorActuator: "27-31", rudderActuator: "27-21", battery: "24-31", tru: "24-32", gcu: "24-22",
  packValve: "21-51", cpc: "21-31", bleedValve: "36-11", deiceValve: "30-12",
};
function ataOf(key: string): string {
  return ATA[key] ?? "00-00";
}
function round(value: number): number {
  return Math.round(value * 100) / 100;
}
