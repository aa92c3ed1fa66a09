/**
 * Outside checks of lib/flow against Debian's python3-fluids (fluids.friction.Colebrook,
 * Haaland, Swamee_Jain_1976; fluids.core.Reynolds) and python3-scipy / python3-numpy
 * (scipy.integrate.quad for chord means, numpy.polynomial.legendre.leggauss and
 * scipy.special.roots_chebyu for multi-chord nodes), via /usr/bin/python3.
 */
import { assert, closeRel } from "../_assert.ts";
import { debianVersion, hasPython, runPython } from "../_python.ts";
import {
  chordMeanVelocity,
  chordWeights,
  frictionFactor,
  frictionFactorExplicit,
  profileShape,
  reynoldsNumber,
} from "../../lib/flow/mod.ts";

const RES = [4e3, 1e4, 3e4, 1e5, 3e5, 1e6, 3e6, 1e7, 3e7, 1e8];
const RRS = [0, 1e-6, 1e-5, 1e-4, 1e-3, 5e-3, 1e-2, 2e-2, 5e-2];

Deno.test({
  name: "Colebrook–White vs python3-fluids fluids.friction.Colebrook (Re 4e3–1e8, ε/D 0–0.05)",
  ignore: !hasPython("fluids"),
  async fn() {
    const grid = RES.flatMap((re) => RRS.map((rr) => [re, rr]));
    const ref = await runPython<{ c: number[]; h: number[]; s: number[] }>(
      `import json,sys
from fluids.friction import Colebrook, Haaland, Swamee_Jain_1976
g=json.load(sys.stdin)
print(json.dumps({"c":[Colebrook(r,e) for r,e in g],"h":[Haaland(r,e) for r,e in g],
 "s":[Swamee_Jain_1976(r,e) for r,e in g]}))`,
      grid,
    );
    let worstC = 0, worstH = 0, worstS = 0;
    grid.forEach(([re, rr], i) => {
      // python3-fluids Colebrook: analytical Lambert-W solution
      worstC = Math.max(worstC, closeRel(frictionFactor(re, rr), ref.c[i], 1e-12, `C ${re} ${rr}`));
      worstH = Math.max(
        worstH,
        closeRel(
          frictionFactorExplicit(re, rr, "haaland", { extrapolate: true }),
          ref.h[i],
          1e-12,
          `H ${re} ${rr}`,
        ),
      );
      worstS = Math.max(
        worstS,
        closeRel(
          frictionFactorExplicit(re, rr, "swamee-jain", { extrapolate: true }),
          ref.s[i],
          // the library's Swamee–Jain differs from the published 0.25/[log10(…)]² form by
          // < 2e-6 relative (a rounding of its constants); our form follows the paper
          5e-6,
          `S ${re} ${rr}`,
        ),
      );
    });
    console.log(
      `python3-fluids ${debianVersion("python3-fluids")}: worst relative difference ` +
        `Colebrook ${worstC.toExponential(2)}, Haaland ${worstH.toExponential(2)}, ` +
        `Swamee–Jain ${worstS.toExponential(2)}`,
    );
  },
});

Deno.test({
  name: "Reynolds number vs python3-fluids fluids.core.Reynolds",
  ignore: !hasPython("fluids"),
  async fn() {
    const cases = [[1.5, 0.2, 1.0e-6], [0.03, 0.025, 4.5e-5], [4, 1.2, 2.9e-7]];
    const ref = await runPython<number[]>(
      `import json,sys
from fluids.core import Reynolds
print(json.dumps([Reynolds(V=v,D=d,nu=n) for v,d,n in json.load(sys.stdin)]))`,
      cases,
    );
    cases.forEach(([v, d, n], i) => closeRel(reynoldsNumber(v, d, n), ref[i], 1e-15, "Re"));
  },
});

Deno.test({
  name: "chord means of the profiles vs scipy.integrate.quad (python3-scipy)",
  ignore: !hasPython("scipy"),
  async fn() {
    const cases: { model: "power-law-nikuradse" | "log-law"; re: number; h: number }[] = [];
    for (const model of ["power-law-nikuradse", "log-law"] as const) {
      for (const re of [2.3e4, 1e5, 1e6]) {
        for (const h of [0.05, 0.2, 0.5, 0.8, 0.95]) cases.push({ model, re, h });
      }
    }
    const shapes = cases.map((c) => profileShape(c.re, { model: c.model }));
    const ref = await runPython<number[]>(
      `import json,sys,math
from scipy.integrate import quad
out=[]
for s,h in json.load(sys.stdin):
  g=math.sqrt(1-h*h)
  def u(t):
    r=math.sqrt(h*h+(g*t)**2)
    if s["kind"]=="power": return s["cn"]*(1-r)**(1/s["n"])
    return 1+s["beta"]*(math.log(1-r)+1.5)/s["kappa"]
  v,_=quad(u,0,1,epsabs=1e-14,epsrel=1e-13,limit=200)
  out.append(v)
print(json.dumps(out))`,
      cases.map((c, i) => [{
        kind: shapes[i].turbulentKind,
        cn: shapes[i].cn,
        n: shapes[i].n,
        beta: shapes[i].beta,
        kappa: shapes[i].kappa,
      }, c.h]),
    );
    let worst = 0;
    cases.forEach((c, i) => {
      worst = Math.max(
        worst,
        closeRel(chordMeanVelocity(shapes[i], c.h), ref[i], 2e-9, `${c.model} ${c.re} h=${c.h}`),
      );
    });
    console.log(`chord means vs scipy quad: worst relative difference ${worst.toExponential(2)}`);
  },
});

Deno.test({
  name: "multi-chord nodes vs numpy leggauss and scipy roots_chebyu (Gauss–Jacobi ½,½)",
  ignore: !hasPython("scipy", "numpy"),
  async fn() {
    const ref = await runPython<{ lg: number[][][]; cu: number[][][] }>(
      `import json
import numpy as np
from scipy.special import roots_chebyu
lg=[[list(a) for a in np.polynomial.legendre.leggauss(n)] for n in range(2,6)]
cu=[[list(map(float,a)) for a in roots_chebyu(n)] for n in range(2,6)]
print(json.dumps({"lg":lg,"cu":cu}))`,
    );
    for (let n = 2; n <= 5; n++) {
      const gl = chordWeights(n, "gauss-legendre");
      const gj = chordWeights(n, "gauss-jacobi");
      const [x, w] = ref.lg[n - 2];
      const [xc, wc] = ref.cu[n - 2];
      const order = xc.map((v, i) => [v, wc[i]]).sort((a, b) => a[0] - b[0]);
      for (let i = 0; i < n; i++) {
        assert.ok(Math.abs(gl.positions[i] - x[i]) < 1e-14, `GL node ${n}/${i}`);
        const wGl = (2 / Math.PI) * w[i] * Math.sqrt(1 - x[i] * x[i]);
        assert.ok(Math.abs(gl.weights[i] - wGl) < 1e-14, `GL weight ${n}/${i}`);
        assert.ok(Math.abs(gj.positions[i] - order[i][0]) < 1e-14, `GJ node ${n}/${i}`);
        // roots_chebyu weights integrate against √(1−x²); our weights are (2/π)·those
        assert.ok(
          Math.abs(gj.weights[i] - (2 / Math.PI) * order[i][1]) < 1e-14,
          `GJ weight ${n}/${i}`,
        );
      }
    }
  },
});
