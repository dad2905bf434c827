/* Full-precision Tissot factors from PROJ's proj_factors(), for comparison tests and the bench.
 * Usage: factors '<proj string>'            reads "lon lat" (degrees) lines on stdin and prints
 *                                           h k s omega_deg a b convergence_deg thetap_deg (%.17g)
 *                                           then a b omega_deg again, recomputed from PROJ's own
 *                                           partial derivatives without the cancellation of
 *                                           sqrt(h² + k² − 2s) (see stable_axes)
 *        factors --time N '<proj string>'   reads the points once, calls proj_factors() on all of
 *                                           them N times and prints "points wall_s sink cpu_s".  */
#include <proj.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <math.h>
#include <time.h>

#define DEG (M_PI / 180.0)

/* Tissot axes from PROJ's derivatives, scaled so that |north| = h and |east| = k as PROJ reports:
 * a' = |(p + t, q − r)|, b' = |(p − t, q + r)| with east = (p, q), north = (r, t). */
static void stable_axes(const PJ_FACTORS *f, double *a, double *b, double *omega_deg) {
  double ln = hypot(f->dx_dlam, f->dy_dlam), lp = hypot(f->dx_dphi, f->dy_dphi);
  double p = f->dx_dlam * f->parallel_scale / ln, q = f->dy_dlam * f->parallel_scale / ln;
  double r = f->dx_dphi * f->meridional_scale / lp, t = f->dy_dphi * f->meridional_scale / lp;
  double ap = hypot(p + t, q - r), bp = hypot(p - t, q + r);
  if (p * t - q * r < 0) { double w = ap; ap = bp; bp = w; }
  *a = 0.5 * (ap + bp);
  *b = 0.5 * (ap - bp);
  *omega_deg = 2 * asin(bp / ap) / DEG;
}

static double now_s(void) {
  struct timespec ts;
  clock_gettime(CLOCK_MONOTONIC, &ts);
  return ts.tv_sec + ts.tv_nsec * 1e-9;
}

static double cpu_s(void) {
  struct timespec ts;
  clock_gettime(CLOCK_PROCESS_CPUTIME_ID, &ts);
  return ts.tv_sec + ts.tv_nsec * 1e-9;
}

int main(int argc, char **argv) {
  int repeat = 0;
  const char *def;
  if (argc == 4 && strcmp(argv[1], "--time") == 0) { repeat = atoi(argv[2]); def = argv[3]; }
  else if (argc == 2) def = argv[1];
  else { fprintf(stderr, "usage: factors [--time N] '<proj string>'\n"); return 2; }

  PJ_CONTEXT *ctx = proj_context_create();
  PJ *P = proj_create(ctx, def);
  if (!P) { fprintf(stderr, "proj_create failed: %s\n", proj_context_errno_string(ctx, proj_context_errno(ctx))); return 2; }
  proj_log_level(ctx, PJ_LOG_NONE);

  size_t cap = 1 << 16, n = 0;
  double *lon = malloc(cap * sizeof(double)), *lat = malloc(cap * sizeof(double));
  char line[512];
  while (fgets(line, sizeof line, stdin)) {
    double x, y;
    if (sscanf(line, "%lf %lf", &x, &y) != 2) continue;
    if (repeat == 0) {
      PJ_FACTORS f = proj_factors(P, proj_coord(x * DEG, y * DEG, 0, 0));
      if (proj_errno(P)) {
        proj_errno_reset(P);
        printf("nan\tnan\tnan\tnan\tnan\tnan\tnan\tnan\tnan\tnan\tnan\n");
      } else {
        double sa, sb, so;
        stable_axes(&f, &sa, &sb, &so);
        printf("%.17g\t%.17g\t%.17g\t%.17g\t%.17g\t%.17g\t%.17g\t%.17g\t%.17g\t%.17g\t%.17g\n",
               f.meridional_scale, f.parallel_scale, f.areal_scale, f.angular_distortion / DEG,
               f.tissot_semimajor, f.tissot_semiminor, f.meridian_convergence / DEG,
               f.meridian_parallel_angle / DEG, sa, sb, so);
      }
      continue;
    }
    if (n == cap) { cap *= 2; lon = realloc(lon, cap * sizeof(double)); lat = realloc(lat, cap * sizeof(double)); }
    lon[n] = x * DEG; lat[n] = y * DEG; n++;
  }
  if (repeat > 0) {
    double sink = 0, t0 = now_s(), c0 = cpu_s();
    for (int r = 0; r < repeat; r++)
      for (size_t i = 0; i < n; i++) {
        PJ_FACTORS f = proj_factors(P, proj_coord(lon[i], lat[i], 0, 0));
        sink += f.areal_scale;
      }
    double t1 = now_s(), c1 = cpu_s();
    printf("%zu\t%.6f\t%g\t%.6f\n", n * (size_t)repeat, t1 - t0, sink, c1 - c0);
  }
  proj_destroy(P);
  proj_context_destroy(ctx);
  return 0;
}
