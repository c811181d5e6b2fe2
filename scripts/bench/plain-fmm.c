/*
 * A straightforward single-thread fast marcher in C, the benchmark's compiled yardstick
 * (scripts/bench/compiled-reference.ts compiles it with the system's gcc and runs it on the
 * benchmark's own grids). Indexed binary heap with decrease-key, four neighbours, upwind
 * updates of first order, or of second order where two accepted nodes lie upwind on an axis
 * (Sethian 1999, "Level Set Methods and Fast Marching Methods", ch. 8; Rickett & Fomel 1999,
 * from memory). Source on a node. No factoring, no accuracy features: it measures speed only.
 *
 * Input (binary, little-endian): int32 nx, nz, source node, order, repeats; float64 h;
 * float32 velocity[nx·nz]. Output on stdout: one line per solve, "seconds <s>", then
 * "checksum <sum of finite times>" of the last solve.
 */
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <time.h>

#define FAR 0
#define TRIAL 1
#define DONE 2

static int nx, nz, n;
static double h;
static double *T, *S;
static unsigned char *state;
/* Heap of (key, node) by position; slot[node] = position. Keys kept in the heap for locality. */
static int *heap, *slot, heapSize;
static double *keys;

static void place(int i, double key, int node) {
  keys[i] = key; heap[i] = node; slot[node] = i;
}

static void siftUp(int i) {
  double key = keys[i]; int node = heap[i];
  while (i > 0) {
    int parent = (i - 1) >> 1;
    if (keys[parent] <= key) break;
    place(i, keys[parent], heap[parent]);
    i = parent;
  }
  place(i, key, node);
}

static void siftDown(int i) {
  double key = keys[i]; int node = heap[i];
  for (;;) {
    int l = 2 * i + 1, r = l + 1, m = l;
    if (l >= heapSize) break;
    if (r < heapSize && keys[r] < keys[l]) m = r;
    if (keys[m] >= key) break;
    place(i, keys[m], heap[m]);
    i = m;
  }
  place(i, key, node);
}

static void pushOrDecrease(int node) {
  if (state[node] == TRIAL) { keys[slot[node]] = T[node]; siftUp(slot[node]); return; }
  state[node] = TRIAL;
  place(heapSize, T[node], node);
  heapSize++;
  siftUp(heapSize - 1);
}

static int pop(void) {
  int top = heap[0];
  heapSize--;
  if (heapSize > 0) { place(0, keys[heapSize], heap[heapSize]); siftDown(0); }
  return top;
}

/* Upwind coefficients along one axis from the accepted neighbours q1 (next) and q2 (next but one). */
static void axisTerm(int q1, int q2, int order, double *a, double *b, double *c) {
  if (q1 < 0 || state[q1] != DONE) return;
  if (order == 2 && q2 >= 0 && state[q2] == DONE && T[q2] <= T[q1]) {
    /* (3T − 4T1 + T2) / 2h */
    double t = (4 * T[q1] - T[q2]) / 3;
    double k = 9.0 / (4 * h * h);
    *a += k; *b += -2 * k * t; *c += k * t * t;
  } else {
    double k = 1 / (h * h);
    *a += k; *b += -2 * k * T[q1]; *c += k * T[q1] * T[q1];
  }
}

static double update(int q, int order) {
  int iz = q / nx, ix = q - iz * nx;
  double best = INFINITY;
  /* Best upwind neighbour per axis (the smaller of the two sides). */
  int xl = ix > 0 ? q - 1 : -1, xr = ix < nx - 1 ? q + 1 : -1;
  int zu = iz > 0 ? q - nx : -1, zd = iz < nz - 1 ? q + nx : -1;
  int x1 = -1, x2 = -1, z1 = -1, z2 = -1;
  if (xl >= 0 && state[xl] == DONE) { x1 = xl; x2 = ix > 1 ? q - 2 : -1; }
  if (xr >= 0 && state[xr] == DONE && (x1 < 0 || T[xr] < T[x1])) { x1 = xr; x2 = ix < nx - 2 ? q + 2 : -1; }
  if (zu >= 0 && state[zu] == DONE) { z1 = zu; z2 = iz > 1 ? q - 2 * nx : -1; }
  if (zd >= 0 && state[zd] == DONE && (z1 < 0 || T[zd] < T[z1])) { z1 = zd; z2 = iz < nz - 2 ? q + 2 * nx : -1; }
  double s2 = S[q] * S[q];
  /* Both axes together, if the root is causal; otherwise each axis alone. */
  if (x1 >= 0 && z1 >= 0) {
    double a = 0, b = 0, c = -s2;
    axisTerm(x1, x2, order, &a, &b, &c);
    axisTerm(z1, z2, order, &a, &b, &c);
    double disc = b * b - 4 * a * c;
    if (disc >= 0) {
      double t = (-b + sqrt(disc)) / (2 * a);
      if (t >= T[x1] && t >= T[z1]) best = t;
    }
  }
  if (best == INFINITY) {
    int axes[2][2] = {{x1, x2}, {z1, z2}};
    for (int k = 0; k < 2; k++) {
      if (axes[k][0] < 0) continue;
      double a = 0, b = 0, c = -s2;
      axisTerm(axes[k][0], axes[k][1], order, &a, &b, &c);
      double disc = b * b - 4 * a * c;
      if (disc < 0) continue;
      double t = (-b + sqrt(disc)) / (2 * a);
      if (t < best) best = t;
    }
  }
  return best;
}

static void solve(int source, int order) {
  for (int i = 0; i < n; i++) { T[i] = INFINITY; state[i] = FAR; }
  heapSize = 0;
  T[source] = 0;
  pushOrDecrease(source);
  while (heapSize > 0) {
    int p = pop();
    state[p] = DONE;
    int iz = p / nx, ix = p - iz * nx;
    int nb[4] = {ix > 0 ? p - 1 : -1, ix < nx - 1 ? p + 1 : -1, iz > 0 ? p - nx : -1, iz < nz - 1 ? p + nx : -1};
    for (int d = 0; d < 4; d++) {
      int q = nb[d];
      if (q < 0 || state[q] == DONE) continue;
      double t = update(q, order);
      if (t < T[q]) { T[q] = t; pushOrDecrease(q); }
    }
  }
}

int main(int argc, char **argv) {
  if (argc != 2) { fprintf(stderr, "usage: plain-fmm INPUT\n"); return 2; }
  FILE *f = fopen(argv[1], "rb");
  if (!f) { perror(argv[1]); return 2; }
  int32_t head[5];
  if (fread(head, sizeof head, 1, f) != 1 || fread(&h, sizeof h, 1, f) != 1) { fprintf(stderr, "short header\n"); return 2; }
  nx = head[0]; nz = head[1]; n = nx * nz;
  int source = head[2], order = head[3], repeats = head[4];
  float *v = malloc(sizeof(float) * n);
  if (fread(v, sizeof(float), n, f) != (size_t)n) { fprintf(stderr, "short velocity\n"); return 2; }
  fclose(f);
  T = malloc(sizeof(double) * n); S = malloc(sizeof(double) * n);
  state = malloc(n); heap = malloc(sizeof(int) * n); slot = malloc(sizeof(int) * n); keys = malloc(sizeof(double) * n);
  for (int i = 0; i < n; i++) S[i] = 1.0 / v[i];
  for (int r = 0; r < repeats; r++) {
    struct timespec a, b;
    clock_gettime(CLOCK_MONOTONIC, &a);
    solve(source, order);
    clock_gettime(CLOCK_MONOTONIC, &b);
    printf("seconds %.9f\n", (b.tv_sec - a.tv_sec) + 1e-9 * (b.tv_nsec - a.tv_nsec));
  }
  double sum = 0;
  for (int i = 0; i < n; i++) if (isfinite(T[i])) sum += T[i];
  printf("checksum %.12g\n", sum);
  return 0;
}
