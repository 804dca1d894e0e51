/* xoshiro128** 1.1 (Blackman & Vigna 2018), next() as in the reference xoshiro128starstar.c at
   prng.di.unimi.it (transcribed from memory), seeded the way seedsift's random.ts documents:
   four SplitMix32 outputs (state += 0x9e3779b9; murmur3 fmix32 finaliser), all-zero guard. */
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
static inline uint32_t rotl(const uint32_t x, int k) { return (x << k) | (x >> (32 - k)); }
static uint32_t s[4];
uint32_t next(void) {
	const uint32_t result = rotl(s[1] * 5, 7) * 9;
	const uint32_t t = s[1] << 9;
	s[2] ^= s[0];
	s[3] ^= s[1];
	s[1] ^= s[2];
	s[0] ^= s[3];
	s[2] ^= t;
	s[3] = rotl(s[3], 11);
	return result;
}
static uint32_t sm;
static uint32_t splitmix32(void) {
	uint32_t z = (sm += 0x9e3779b9u);
	z = (z ^ (z >> 16)) * 0x85ebca6bu;
	z = (z ^ (z >> 13)) * 0xc2b2ae35u;
	return z ^ (z >> 16);
}
int main(int argc, char **argv) {
	int32_t seed = (int32_t)atol(argv[1]);
	sm = (uint32_t)seed;
	for (int i = 0; i < 4; i++) s[i] = splitmix32();
	if ((s[0] | s[1] | s[2] | s[3]) == 0) s[0] = 1;
	for (int i = 0; i < 6; i++) printf("%u%s", next(), i < 5 ? ", " : "\n");
	for (int i = 0; i < 994; i++) next();
	printf("1001st: %u\n", next());
	return 0;
}
