#pragma once
// FINESTRA_VECTOR_CLONES marks a hot numerical function for function multi-versioning: GCC compiles
// it twice (AVX2 + FMA, and the baseline x86-64) and picks the version the CPU supports when the
// program loads, so one binary runs everywhere and uses the wide units where they exist.
#if defined(__GNUC__) && !defined(__clang__) && defined(__x86_64__) && defined(__linux__)
#define FINESTRA_VECTOR_CLONES __attribute__((target_clones("arch=x86-64-v3", "default")))
#else
#define FINESTRA_VECTOR_CLONES
#endif
