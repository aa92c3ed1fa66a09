/**
 * Provenance of the distorted-profile model: each estimate names the source and basis of the
 * constants it used, and the plan's trace and budget carry them instead of a fixed label.
 */
import { assert } from "../_assert.ts";
import {
  JUDGEMENT_RELATIVE_SPREAD,
  MODEL_RELATIVE_SPREAD,
  modelProvenance,
  profileErrorEstimate,
  resolveFitting,
} from "../../lib/installation/mod.ts";
import { planStraightRun } from "../../lib/site/stages/run.ts";
import { defaultRegistry } from "../../lib/registry/mod.ts";

Deno.test("provenance: the fitted elbow cites its data, judgement fittings say recalled", () => {
  const reg = defaultRegistry();
  for (const f of reg.fittings()) {
    const p = modelProvenance(f.id);
    const e = profileErrorEstimate({ distanceDiameters: 3, fitting: f.id, orientation: 0.4 });
    assert.equal(e.source, p.source, f.id);
    assert.equal(e.basis, p.basis, f.id);
    // the source resolves in data/sources.yaml
    assert.ok(reg.source(p.source), `${f.id}: ${p.source}`);
    // the spread follows the basis: wider where the terms are judgement
    const want = p.basis === "recalled" ? JUDGEMENT_RELATIVE_SPREAD : MODEL_RELATIVE_SPREAD;
    assert.ok(Math.abs(e.spread - want * Math.abs(e.error)) <= 1e-15, f.id);
    // the entry in data/fittings.yaml is what decides
    assert.equal(p.source, resolveFitting(f.id).disturbance.source ?? p.source);
  }
  assert.equal(modelProvenance("elbow-90").source, "synowiec-2021-abstract");
  assert.equal(modelProvenance("elbow-90").basis, "computed");
  for (const f of ["pump", "butterfly-valve", "double-elbow-out-of-plane"]) {
    assert.equal(modelProvenance(f).source, "snellpath-installation-model");
    assert.equal(modelProvenance(f).basis, "recalled");
  }
});

Deno.test("provenance: the straight-run stage traces the estimate's own source and basis", () => {
  const stage = (fitting: string) =>
    planStraightRun(
      {
        run: { length: 3, upstream: { fitting }, downstream: { fitting: "gate-valve" } },
        bore: 0.2,
        relativeRoughness: 0,
        points: [{ label: "design", reynolds: 1e5 }],
        traverses: 2,
        fluidAngle: 0.35,
      } as unknown as Parameters<typeof planStraightRun>[0],
    );
  for (const fitting of ["elbow-90", "pump"]) {
    const s = stage(fitting);
    const p = modelProvenance(fitting);
    const t = s.trace.find((e) => e.quantity.startsWith("formulation: distorted-profile model"));
    assert.ok(t, fitting);
    assert.equal(t.source, p.source);
    assert.equal(t.basis, p.basis);
    assert.equal(s.installProvenance.source, p.source);
    assert.equal(s.installProvenance.basis, p.basis);
  }
});
