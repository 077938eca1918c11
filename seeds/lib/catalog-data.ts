// The invented catalog: part numbers (prefix QF-), invented CAGE codes, ATA chapters per iSpec 2200
// numbering, and life limits chosen for the demo only.
export interface DemoPartNumber {
  key: string;
  partNumber: string;
  cage: string;
  description: string;
  ata: string;
  lifeHours?: number;
  lifeCycles?: number;
  lifeDays?: number;
  overhaulHours?: number;
  overhaulCycles?: number;
  serialPrefix: string;
}

const pn = (
  key: string,
  partNumber: string,
  cage: string,
  description: string,
  ata: string,
  serialPrefix: string,
  limits: Partial<Pick<DemoPartNumber, "lifeHours" | "lifeCycles" | "lifeDays" | "overhaulHours" | "overhaulCycles">> = {},
): DemoPartNumber => ({ key, partNumber, cage, description, ata, serialPrefix, ...limits });

export const DEMO_PART_NUMBERS: DemoPartNumber[] = [
  pn("mainWheel", "QF-3241-10", "Q4W17", "Main wheel assembly", "32-41", "MW"),
  pn("mainWheelB", "QF-3241-11", "Q4W17", "Main wheel assembly, forged hub", "32-41", "MX"),
  pn("noseWheel", "QF-3241-20", "Q4W17", "Nose wheel assembly", "32-41", "NW"),
  pn("brake", "QF-3242-10", "Q4B22", "Electric brake assembly, carbon heat sink", "32-42", "BK", { overhaulCycles: 2400 }),
  pn("brakeB", "QF-3242-12", "Q4B22", "Electric brake assembly, improved heat sink", "32-42", "BL", { overhaulCycles: 2800 }),
  pn("brakeActuator", "QF-3242-50", "Q4B22", "Electric brake actuator", "32-42", "EA"),
  pn("brakeActuatorB", "QF-3242-51", "Q4B22", "Electric brake actuator, sealed motor", "32-42", "EB"),
  pn("wheelSpeed", "QF-3242-70", "Q4B22", "Wheel speed transducer", "32-42", "WS"),
  pn("brakeTemp", "QF-3242-80", "Q4B22", "Brake temperature sensor", "32-42", "BT"),
  pn("mlgRetract", "QF-3231-10", "Q2G05", "Main gear retraction actuator", "32-31", "MR", { lifeCycles: 20000 }),
  pn("nlgRetract", "QF-3231-20", "Q2G05", "Nose gear retraction actuator", "32-31", "NR", { lifeCycles: 20000 }),
  pn("uplock", "QF-3232-10", "Q2G05", "Main gear uplock actuator", "32-32", "UL"),
  pn("steering", "QF-3251-10", "Q2G05", "Nose wheel steering actuator", "32-51", "ST"),
  pn("mlgStrut", "QF-3211-10", "Q2G05", "Main gear shock strut", "32-11", "MS", { lifeCycles: 60000, overhaulCycles: 18000 }),
  pn("nlgStrut", "QF-3221-10", "Q2G05", "Nose gear shock strut", "32-21", "NS", { lifeCycles: 60000, overhaulCycles: 18000 }),
  pn("adiru", "QF-3412-10", "Q7A31", "Air data inertial reference unit", "34-12", "AD"),
  pn("weatherRadar", "QF-3441-10", "Q7A31", "Weather radar transceiver", "34-41", "WR"),
  pn("radioAltimeter", "QF-3433-10", "Q7A31", "Radio altimeter transceiver", "34-33", "RA"),
  pn("transponder", "QF-3452-10", "Q7A31", "ATC transponder", "34-52", "XP"),
  pn("dme", "QF-3451-10", "Q7A31", "DME interrogator", "34-51", "DM"),
  pn("vhfNav", "QF-3455-10", "Q7A31", "VHF navigation receiver", "34-55", "VN"),
  pn("vhfCom", "QF-2312-10", "Q7C08", "VHF communication transceiver", "23-12", "VC"),
  pn("display", "QF-3161-10", "Q7C08", "Flight deck display unit", "31-61", "DU"),
  pn("displayB", "QF-3161-11", "Q7C08", "Flight deck display unit, LED backlight", "31-61", "DV"),
  pn("fdr", "QF-3131-10", "Q7C08", "Flight data recorder", "31-31", "FR", { lifeDays: 3650 }),
  pn("cvr", "QF-2371-10", "Q7C08", "Cockpit voice recorder", "23-71", "CV", { lifeDays: 3650 }),
  pn("maintComputer", "QF-4510-10", "Q7C08", "Central maintenance computer", "45-10", "CM"),
  pn("fcc", "QF-2211-10", "Q7A31", "Flight control computer", "22-11", "FC"),
  pn("fuelPump", "QF-7311-10", "Q3E44", "Engine fuel pump", "73-11", "FP", { overhaulHours: 8000 }),
  pn("fmu", "QF-7321-10", "Q3E44", "Fuel metering unit", "73-21", "FM", { overhaulHours: 10000 }),
  pn("starter", "QF-8011-10", "Q3E44", "Air turbine starter", "80-11", "AS"),
  pn("starterB", "QF-8011-11", "Q3E44", "Air turbine starter, revised clutch", "80-11", "AT"),
  pn("generator", "QF-2421-10", "Q5P12", "Engine-driven AC generator", "24-21", "GN", { overhaulHours: 10000 }),
  pn("hydPump", "QF-2911-10", "Q5P12", "Engine-driven hydraulic pump", "29-11", "HP", { lifeHours: 30000, overhaulHours: 12000 }),
  pn("exciter", "QF-7411-10", "Q3E44", "Ignition exciter", "74-11", "IX"),
  pn("oilPressure", "QF-7931-10", "Q3E44", "Oil pressure transmitter", "79-31", "OP"),
  pn("egtHarness", "QF-7721-10", "Q3E44", "EGT thermocouple harness", "77-21", "EG"),
  pn("aileronActuator", "QF-2711-10", "Q6F09", "Aileron actuator", "27-11", "AI", { lifeHours: 40000 }),
  pn("elevatorActuator", "QF-2731-10", "Q6F09", "Elevator actuator", "27-31", "EL", { lifeHours: 40000 }),
  pn("rudderActuator", "QF-2721-10", "Q6F09", "Rudder actuator", "27-21", "RU", { lifeHours: 40000 }),
  pn("spoilerActuator", "QF-2761-10", "Q6F09", "Spoiler actuator", "27-61", "SP"),
  pn("flapActuator", "QF-2751-10", "Q6F09", "Flap ball-screw actuator", "27-51", "FL", { lifeCycles: 48000 }),
  pn("battery", "QF-2431-10", "Q5P12", "Main battery", "24-31", "BA", { lifeDays: 1460 }),
  pn("tru", "QF-2432-10", "Q5P12", "Transformer rectifier unit", "24-32", "TR"),
  pn("gcu", "QF-2422-10", "Q5P12", "Generator control unit", "24-22", "GC"),
  pn("packValve", "QF-2151-10", "Q8N03", "Pack flow control valve", "21-51", "PV"),
  pn("cpc", "QF-2131-10", "Q8N03", "Cabin pressure controller", "21-31", "CP"),
  pn("bleedValve", "QF-3611-10", "Q8N03", "Bleed pressure regulating valve", "36-11", "BV"),
  pn("apuStarterGen", "QF-4942-10", "Q5P12", "APU starter-generator", "49-42", "AG", { overhaulHours: 6000 }),
  pn("propControl", "QF-6121-10", "Q3E44", "Propeller control unit", "61-21", "PC", { overhaulHours: 9000 }),
  pn("overspeedGov", "QF-6122-10", "Q3E44", "Propeller overspeed governor", "61-22", "OG"),
  pn("deiceTimer", "QF-3011-10", "Q8N03", "De-ice timer", "30-11", "DT"),
  pn("deiceValve", "QF-3012-10", "Q8N03", "Airframe de-ice valve", "30-12", "DX"),
];

/** Alternates: [part number key, alternate key, two-way]. */
export const DEMO_INTERCHANGE: Array<[string, string, boolean]> = [
  ["mainWheel", "mainWheelB", true],
  ["brake", "brakeB", false], // the improved brake replaces the original, not the other way round
  ["brakeActuator", "brakeActuatorB", true],
  ["display", "displayB", true],
  ["starter", "starterB", false],
];
