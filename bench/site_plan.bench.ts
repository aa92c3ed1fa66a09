/**
 * The whole plan of one site (invented demo site 01): without Monte Carlo, and with the default
 * Monte Carlo of 10⁵ draws beside GUM. The site file is read once, outside the timing.
 */
import { readSiteFile } from "../lib/site/read.ts";
import { planSite } from "../lib/site/plan.ts";

const site = await readSiteFile("data/demo/01-reservoir-outlet.yaml");
planSite(site, { monteCarlo: false }); // registry, coefficient sets and JIT before timing

Deno.bench("planSite, one site, no Monte Carlo", { group: "plan", baseline: true }, () => {
  planSite(site, { monteCarlo: false });
});

Deno.bench("planSite, one site, Monte Carlo 1e5 draws", { group: "plan" }, () => {
  planSite(site);
});
