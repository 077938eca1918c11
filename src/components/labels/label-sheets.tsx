import type { ReactNode } from "react";
import "./part-label.css";

/** Paper for 100 x 50 mm labels: a label printer's roll, or sheets of 2 x 5 labels. */
export const LABEL_LAYOUTS = {
  label: { name: "One label, 100 × 50 mm", page: "size: 100mm 50mm; margin: 0;", perSheet: 1 },
  a4: { name: "A4 sheet, 2 × 5 labels", page: "size: A4; margin: 23.5mm 5mm;", perSheet: 10 },
  letter: { name: "Letter sheet, 2 × 5 labels", page: "size: letter; margin: 14.7mm 7.9mm;", perSheet: 10 },
} as const;
export type LabelLayout = keyof typeof LABEL_LAYOUTS;
export const LABEL_LAYOUT_KEYS = Object.keys(LABEL_LAYOUTS) as LabelLayout[];

/** The @page rule of the layout; put it once on the page. */
export function LabelPageStyle({ layout }: { layout: LabelLayout }) {
  return <style>{`@page { ${LABEL_LAYOUTS[layout].page} }`}</style>;
}

/** Labels in print order: one per page on a label roll, else in sheets of 2 x 5, a page each. */
export function LabelSheets({ layout, labels }: { layout: LabelLayout; labels: ReactNode[] }) {
  const perSheet = LABEL_LAYOUTS[layout].perSheet;
  if (layout === "label") return <div className="label-print-area">{labels}</div>;
  const sheets = Array.from({ length: Math.ceil(labels.length / perSheet) }, (_, sheet) => labels.slice(sheet * perSheet, (sheet + 1) * perSheet));
  return (
    <div className="label-print-area">
      {sheets.map((sheet, i) => (
        <div key={i} className="label-sheet">
          {sheet}
        </div>
      ))}
    </div>
  );
}

export function LabelLayoutSelect({ id, layout }: { id: string; layout: LabelLayout }) {
  return (
    <div>
      <label htmlFor={id} className="field-label">
        Paper
      </label>
      <select id={id} name="layout" defaultValue={layout} className="field-input">
        {LABEL_LAYOUT_KEYS.map((key) => (
          <option key={key} value={key}>
            {LABEL_LAYOUTS[key].name}
          </option>
        ))}
      </select>
    </div>
  );
}
