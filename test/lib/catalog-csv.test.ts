import { describe, expect, it } from "vitest";
import { chunkRows, type ReadyRow } from "@/components/catalog/import-chunks";
import { checkCsvHeader, CSV_COLUMNS, CSV_EXAMPLE, parseAlternatesCell, validateCsvRecord } from "@/lib/schemas/catalog-csv";

// The catalog CSV is Threadline's own format; these cases check its rules, not any published value.
// Flight time input (H:MM or decimal hours) follows common practice (trade-facts.md section 5, [M]).

const record = (extra: Record<string, string> = {}) => ({
  part_number: "qt-1000-01",
  cage: "qt001",
  description: "Test pump",
  ata_chapter: "29-11",
  ...extra,
});

describe("checkCsvHeader", () => {
  it("accepts the template header in any order and case, with a byte-order mark", () => {
    expect(checkCsvHeader(["\uFEFFPart_Number", " cage", "DESCRIPTION", "ata_chapter"]).problems).toEqual([]);
    expect(checkCsvHeader([...CSV_COLUMNS]).problems).toEqual([]);
  });

  it("names missing, unknown and repeated columns", () => {
    const { problems } = checkCsvHeader(["part_number", "cage", "descripton", "cage"]);
    expect(problems.join("\n")).toMatch(/Unknown column "descripton"/);
    expect(problems.join("\n")).toMatch(/"cage" appears twice/);
    expect(problems.join("\n")).toMatch(/no "description" column/);
    expect(problems.join("\n")).toMatch(/no "ata_chapter" column/);
  });
});

describe("parseAlternatesCell", () => {
  it("reads P/N:direction pairs, with an optional CAGE", () => {
    expect(parseAlternatesCell("QF-3242-51:two-way; QF-3242-52@Q4B22 : One-Way;")).toEqual({
      alternates: [
        { partNumber: "QF-3242-51", direction: "two-way" },
        { partNumber: "QF-3242-52", cage: "Q4B22", direction: "one-way" },
      ],
    });
  });

  it("refuses an entry without a direction, naming it", () => {
    expect(parseAlternatesCell("QF-3242-51")).toEqual({ error: expect.stringContaining('"QF-3242-51"') });
    expect(parseAlternatesCell("QF-3242-51:both")).toHaveProperty("error");
  });
});

describe("validateCsvRecord", () => {
  it("normalises case, takes H:MM and decimal hours as minutes, and thousands separators in cycles", () => {
    const result = validateCsvRecord(record({ life_limit_hours: "1200:30", overhaul_hours: "850.25", life_limit_cycles: "20,000", serialised: "" }));
    expect(result).toEqual({
      ok: true,
      value: expect.objectContaining({
        partNumber: "QT-1000-01",
        cage: "QT001",
        lifeLimitHours: 72_030,
        overhaulHours: 51_015,
        lifeLimitCycles: 20_000,
        lifeLimitDays: null,
      }),
    });
  });

  it("names every bad column once", () => {
    const result = validateCsvRecord(
      record({ ata_chapter: "3211", cage: "Q4", serialised: "maybe", life_limit_hours: "1:75", life_limit_days: "ten", alternates: "X:sideways", colour: "red" }),
    );
    expect(result.ok).toBe(false);
    const fields = !result.ok ? result.errors.map((e) => e.field).sort() : [];
    expect(fields).toEqual(["alternates", "ata_chapter", "cage", "colour", "life_limit_days", "life_limit_hours", "serialised"]);
  });

  it("requires a part number with limits to be serialised", () => {
    const result = validateCsvRecord(record({ serialised: "no", overhaul_cycles: "900" }));
    expect(result).toEqual({ ok: false, errors: [{ field: "serialised", message: expect.stringMatching(/must be serialised/) }] });
    expect(validateCsvRecord(record({ serialised: "no" })).ok).toBe(true);
  });

  it("accepts every row of the downloadable example file", () => {
    const [header, ...lines] = CSV_EXAMPLE.trim().split("\r\n");
    const columns = header.split(",");
    for (const line of lines) {
      const cells = line.split(",");
      const result = validateCsvRecord(Object.fromEntries(columns.map((c, i) => [c, cells[i] ?? ""])));
      expect(result.ok, line).toBe(true);
    }
  });
});

describe("chunkRows", () => {
  const ready = (row: number, partNumber: string, alternateNames: string[] = []): ReadyRow => ({ row, record: {}, partNumber, alternateNames });

  it("keeps rows linked through alternates in one request, and rows in file order", () => {
    const rows = [ready(2, "A", ["D"]), ready(3, "B"), ready(4, "C"), ready(5, "D", ["E"]), ready(6, "E")];
    const chunks = chunkRows(rows, 2, 500);
    const withA = chunks.find((chunk) => chunk.some((r) => r.partNumber === "A"))!;
    expect(withA.map((r) => r.partNumber)).toEqual(["A", "D", "E"]);
    expect(chunks.flat()).toHaveLength(5);
    for (const chunk of chunks) expect(chunk.map((r) => r.row)).toEqual([...chunk.map((r) => r.row)].sort((a, b) => a - b));
  });

  it("never sends more than the request limit", () => {
    const rows = Array.from({ length: 7 }, (_, i) => ready(i + 2, `P${i}`, i ? [`P${i - 1}`] : []));
    const chunks = chunkRows(rows, 2, 3);
    expect(chunks.every((chunk) => chunk.length <= 3)).toBe(true);
    expect(chunks.flat()).toHaveLength(7);
  });
});
