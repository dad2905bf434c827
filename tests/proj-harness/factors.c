/* Full-precision Tissot factors from PROJ's proj_factors(), for comparison tests and the bench.
 * Usage: factors '<proj string>'            reads "lon lat" (degrees) lines on stdin and prints
 *                                           h k s omega_deg a b convergence_deg thetap_deg (%.17g)
 *        factors --time N '<proj string>'   reads the points once, calls proj_factors() on all of
 *                                           them N times and prints "points seconds" on stdout.  */
#include <proj.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <math.h>
#include <time.h>

#define DEG (M_PI / 180.0)

static double now_s(void) {
  struct timespec ts;
  clock_gettime(CLOCK_MONOTONIC, &ts);
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
        printf("nan\tnan\tnan\tnan\tnan\tnan\tnan\tnan\n");
      } else {
        printf("%.17g\t%.17g\t%.17g\t%.17g\t%.17g\t%.17g\t%.17g\t%.17g\n", f.meridional_scale,
               f.parallel_scale, f.areal_scale, f.angular_distortion / DEG, f.tissot_semimajor,
               f.tissot_semiminor, f.meridian_convergence / DEG, f.meridian_parallel_angle / DEG);
      }
      continue;
    }
    if (n == cap) { cap *= 2; lon = realloc(lon, cap * sizeof(double)); lat = realloc(lat, cap * sizeof(double)); }
    lon[n] = x * DEG; lat[n] = y * DEG; n++;
  }
  if (repeat > 0) {
    double sink = 0, t0 = now_s();
    for (int r = 0; r < repeat; r++)
      for (size_t i = 0; i < n; i++) {
        PJ_FACTORS f = proj_factors(P, proj_coord(lon[i], lat[i], 0, 0));
        sink += f.areal_scale;
      }
    double t1 = now_s();
    printf("%zu\t%.6f\t%g\n", n * (size_t)repeat, t1 - t0, sink);
  }
  proj_destroy(P);
  proj_context_destroy(ctx);
  return 0;
}
