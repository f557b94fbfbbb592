// Component test (Testing Library in jsdom): the Records list says how to make a record when
// there is none, and otherwise shows each record's title, plant with its twin tag, tuning,
// author, date and sign-off state, with the filters as a plain GET form (bookmarkable; common practice).
import { render, screen, within } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import type { RecordList as Data } from "@/app/_lib/records/record-queries";
import { RecordList } from "@/components/records/RecordList";

const empty: Data = { items: [], plants: [], authors: [] };

describe("RecordList", () => {
  it("explains where records come from when there is none", () => {
    render(<RecordList data={empty} filter={{}} />);
    expect(screen.getByTestId("records-empty").textContent).toMatch(/pre-commissioning flow of a plant or a twin/);
  });

  it("lists records with the twin tag and the sign-off state, and filters by GET", () => {
    const data: Data = {
      items: [
        {
          id: "r2",
          title: "Bay 4 hand-over",
          plantRef: "plant:p4",
          plantName: "Bay 4 twin",
          origin: "twin",
          tuning: "PI · Kc 3 %/°C · Ti 300 s",
          authorId: "u1",
          authorName: "Maren Holt",
          createdAt: new Date("2026-03-05T10:00:00Z"),
          signedOffBy: "Maren Holt",
          signedOffOn: "2026-03-06",
        },
        {
          id: "r1",
          title: "C-2 cure loop",
          plantRef: "preset:benchtop-curing-cabinet",
          plantName: "Benchtop curing cabinet",
          origin: "preset",
          tuning: "PID · Kc 5 %/°C · Ti 420 s · Td 20 s",
          authorId: "u2",
          authorName: "Ilse Brand",
          createdAt: new Date("2026-03-01T10:00:00Z"),
          signedOffBy: null,
          signedOffOn: null,
        },
      ],
      plants: [{ ref: "plant:p4", name: "Bay 4 twin" }],
      authors: [{ id: "u1", name: "Maren Holt" }],
    };
    render(<RecordList data={data} filter={{ plantRef: "plant:p4" }} />);
    const rows = screen.getAllByRole("row").slice(1);
    expect(rows).toHaveLength(2);
    expect(within(rows[0]).getByRole("link", { name: "Bay 4 hand-over" }).getAttribute("href")).toBe("/records/r2");
    expect(within(rows[0]).getByText("twin")).toBeTruthy();
    expect(rows[0].textContent).toContain("signed off 2026-03-06");
    expect(rows[1].textContent).toContain("open");
    expect(within(rows[1]).queryByText("twin")).toBeNull();
    const form = screen.getByRole("search");
    expect(form.getAttribute("method")).toBe("get");
    expect((within(form).getByLabelText("Plant") as HTMLSelectElement).value).toBe("plant:p4");
    expect(screen.getByRole("link", { name: "Clear" }).getAttribute("href")).toBe("/records");
  });
});
