/** The readings file reader: letters for mountings, units, refusals that name the field. */
import { assert, closeAbs } from "../_assert.ts";
import { readReadingsText } from "../../lib/site/reconcile_read.ts";
import { InputError } from "../../lib/errors.ts";

Deno.test("readings: Z/V/W letters, units at the edge, optional wrapper", async () => {
  const r = await readReadingsText(`
readings:
  temperature: 59 degF
  wallThickness: 0.25 inch
  mountings:
    - { traverses: Z, totalTime: 0.12 ms, fixedDelay: 6 us }
    - { traverses: w, totalTime: 300 us, deltaT: 140 ns, indicatedVelocity: 1.2 m/s }
`);
  // 59 °F = 15 °C exactly; 0.25 in = 6.35 mm exactly (definitions)
  closeAbs(r.temperature!, 288.15, 1e-9);
  closeAbs(r.wallThickness!, 6.35e-3, 1e-12);
  assert.deepEqual(r.mountings.map((m) => m.traverses), [1, 4]);
  closeAbs(r.mountings[0].totalTime, 120e-6, 1e-15);
  closeAbs(r.mountings[1].deltaT!, 140e-9, 1e-18);
});

Deno.test("readings: refusals name the field", async () => {
  const bad: [string, RegExp][] = [
    ["mountings: [{ traverses: X, totalTime: 1 us }]", /mountings\[0\]\.traverses/],
    ["mountings: [{ traverses: 2 }]", /mountings\[0\]\.totalTime/],
    ["mountings: [{ traverses: 2, totalTime: 5 m }]", /mountings\[0\]\.totalTime/],
    ["mountings: [{ traverses: 2, totalTime: 5 us, colour: red }]", /mountings\[0\]\.colour/],
    ["temprature: 5 degC\nmountings: []", /readings\.temprature/],
    ["mountings: []", /readings\.mountings/],
  ];
  for (const [text, re] of bad) {
    await assert.rejects(() => readReadingsText(text), (e: Error) => {
      assert.ok(e instanceof InputError, text);
      assert.match(e.message, re, text);
      return true;
    });
  }
});
