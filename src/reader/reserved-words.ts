/**
 * Words a spec may not use as a name, because the generated C, TypeScript or
 * GLSL would fail to compile, or would silently mean something else (a macro,
 * a shadowed global). Each group says which language reserves the words and
 * how, so a refusal can give the reason.
 *
 * Sources: ISO/IEC 9899:1999 section 6.4.1 (C99 keywords), ISO/IEC 9899:2011
 * section 6.4.1 (C11) and the C23 keyword list; the standard headers' macro and
 * function names (C99 clause 7: <stddef.h>, <stdio.h>, <stdlib.h>, <string.h>,
 * <math.h>, <float.h>, <limits.h>, <stdint.h>, <errno.h>, <assert.h>,
 * <stdbool.h>, <complex.h>); ECMA-262 section 12.7.2 (reserved words, strict
 * mode and module code); the GLSL ES 3.00 specification section 3.8
 * (keywords, and words reserved for future use) and chapter 8 (built-in
 * functions), with the GLSL 3.30 keyword list added. Lists written from those
 * documents; tests check them against gcc and the TypeScript compiler.
 */

import { TARGET_RESERVED_GROUPS } from './reserved-words-targets.js';

export type Language = 'C' | 'TypeScript' | 'GLSL' | 'WGSL' | 'HLSL' | 'Rust';

export interface ReservedGroup {
  readonly language: Language;
  /** How the language reserves the words, as it reads after "is": "a keyword". */
  readonly kind: string;
  readonly words: readonly string[];
}

const words = (s: string): readonly string[] => s.trim().split(/\s+/);

/** The <math.h> functions of C99 7.12 with their float (f) and long double (l) variants. */
const C_MATH_FUNCTIONS = words(`
  acos asin atan atan2 cos sin tan acosh asinh atanh cosh sinh tanh
  exp exp2 expm1 frexp ilogb ldexp log log10 log1p log2 logb modf scalbn scalbln
  cbrt fabs hypot pow sqrt erf erfc lgamma tgamma ceil floor nearbyint rint lrint
  llrint round lround llround trunc fmod remainder remquo copysign nan nextafter
  nexttoward fdim fmax fmin fma
`).flatMap((f) => [f, `${f}f`, `${f}l`]);

const BASE_GROUPS: readonly ReservedGroup[] = [
  {
    language: 'C',
    kind: 'a keyword',
    words: words(`
      auto break case char const continue default do double else enum extern float
      for goto if inline int long register restrict return short signed sizeof static
      struct switch typedef union unsigned void volatile while
      _Alignas _Alignof _Atomic _Bool _Complex _Generic _Imaginary _Noreturn
      _Static_assert _Thread_local
      alignas alignof bool constexpr false nullptr static_assert thread_local true
      typeof typeof_unqual
    `),
  },
  {
    language: 'C',
    kind: 'a standard macro',
    words: words(`
      NULL EOF BUFSIZ FILENAME_MAX FOPEN_MAX TMP_MAX L_tmpnam SEEK_SET SEEK_CUR SEEK_END
      stdin stdout stderr EXIT_SUCCESS EXIT_FAILURE RAND_MAX MB_CUR_MAX offsetof
      errno EDOM ERANGE EILSEQ assert NDEBUG complex imaginary I noreturn
      INFINITY NAN HUGE_VAL HUGE_VALF HUGE_VALL FP_NAN FP_INFINITE FP_ZERO FP_SUBNORMAL
      FP_NORMAL FP_ILOGB0 FP_ILOGBNAN FP_FAST_FMA FP_FAST_FMAF FP_FAST_FMAL
      MATH_ERRNO MATH_ERREXCEPT math_errhandling
      isfinite isinf isnan isnormal signbit fpclassify isgreater isgreaterequal isless
      islessequal islessgreater isunordered
      FLT_RADIX FLT_ROUNDS FLT_EVAL_METHOD DECIMAL_DIG
      FLT_MANT_DIG FLT_DIG FLT_MIN_EXP FLT_MIN_10_EXP FLT_MAX_EXP FLT_MAX_10_EXP FLT_MAX FLT_EPSILON FLT_MIN
      DBL_MANT_DIG DBL_DIG DBL_MIN_EXP DBL_MIN_10_EXP DBL_MAX_EXP DBL_MAX_10_EXP DBL_MAX DBL_EPSILON DBL_MIN
      LDBL_MANT_DIG LDBL_DIG LDBL_MIN_EXP LDBL_MIN_10_EXP LDBL_MAX_EXP LDBL_MAX_10_EXP LDBL_MAX LDBL_EPSILON LDBL_MIN
      CHAR_BIT SCHAR_MIN SCHAR_MAX UCHAR_MAX CHAR_MIN CHAR_MAX MB_LEN_MAX SHRT_MIN SHRT_MAX
      USHRT_MAX INT_MIN INT_MAX UINT_MAX LONG_MIN LONG_MAX ULONG_MAX LLONG_MIN LLONG_MAX ULLONG_MAX
      INT8_MIN INT16_MIN INT32_MIN INT64_MIN INT8_MAX INT16_MAX INT32_MAX INT64_MAX
      UINT8_MAX UINT16_MAX UINT32_MAX UINT64_MAX INTPTR_MIN INTPTR_MAX UINTPTR_MAX
      INTMAX_MIN INTMAX_MAX UINTMAX_MAX PTRDIFF_MIN PTRDIFF_MAX SIZE_MAX SIG_ATOMIC_MIN
      SIG_ATOMIC_MAX WCHAR_MIN WCHAR_MAX WINT_MIN WINT_MAX
      INT8_C INT16_C INT32_C INT64_C UINT8_C UINT16_C UINT32_C UINT64_C INTMAX_C UINTMAX_C
    `),
  },
  {
    language: 'C',
    kind: 'a standard type name',
    words: words(`
      size_t ptrdiff_t wchar_t FILE fpos_t div_t ldiv_t lldiv_t float_t double_t
      int8_t int16_t int32_t int64_t uint8_t uint16_t uint32_t uint64_t
      int_least8_t int_least16_t int_least32_t int_least64_t uint_least8_t uint_least16_t
      uint_least32_t uint_least64_t int_fast8_t int_fast16_t int_fast32_t int_fast64_t
      uint_fast8_t uint_fast16_t uint_fast32_t uint_fast64_t intptr_t uintptr_t
      intmax_t uintmax_t
    `),
  },
  {
    language: 'C',
    kind: 'a standard library function',
    words: [
      ...C_MATH_FUNCTIONS,
      ...words(`
        printf fprintf sprintf snprintf vprintf vfprintf vsprintf vsnprintf scanf fscanf
        sscanf puts fputs putc fputc putchar getc getchar fgetc fgets gets ungetc fopen
        freopen fclose fflush fread fwrite fseek ftell rewind fgetpos fsetpos feof ferror
        clearerr perror remove rename tmpfile tmpnam setbuf setvbuf
        abs labs llabs div ldiv lldiv atof atoi atol atoll strtod strtof strtold strtol
        strtoll strtoul strtoull rand srand malloc calloc realloc free abort exit atexit
        _Exit getenv system bsearch qsort mblen mbtowc wctomb mbstowcs wcstombs
        memcpy memmove memset memcmp memchr strcpy strncpy strcat strncat strcmp strncmp
        strcoll strxfrm strchr strrchr strspn strcspn strpbrk strstr strtok strlen strerror
      `),
    ],
  },
  { language: 'C', kind: 'the program entry point', words: ['main'] },
  {
    language: 'TypeScript',
    kind: 'a reserved word',
    words: words(`
      break case catch class const continue debugger default delete do else enum export
      extends false finally for function if import in instanceof new null return super
      switch this throw true try typeof var void while with
      implements interface let package private protected public static yield await
    `),
  },
  {
    language: 'TypeScript',
    kind: 'a built-in type name',
    words: words('any boolean number string symbol bigint object never unknown'),
  },
  {
    language: 'TypeScript',
    kind: 'a name strict mode forbids',
    words: words('eval arguments'),
  },
  {
    language: 'TypeScript',
    kind: 'a global value',
    words: words(`
      undefined NaN Infinity globalThis Math Number BigInt Object Array String Boolean
      Symbol JSON console process Error RangeError TypeError Float32Array Float64Array
      Int32Array Uint32Array Uint8Array DataView ArrayBuffer
    `),
  },
  {
    language: 'GLSL',
    kind: 'a keyword',
    words: words(`
      attribute const uniform varying layout centroid flat smooth noperspective break
      continue do for while switch case default if else in out inout float int void bool
      true false invariant discard return struct uint lowp mediump highp precision
      mat2 mat3 mat4 mat2x2 mat2x3 mat2x4 mat3x2 mat3x3 mat3x4 mat4x2 mat4x3 mat4x4
      vec2 vec3 vec4 ivec2 ivec3 ivec4 bvec2 bvec3 bvec4 uvec2 uvec3 uvec4
      sampler1D sampler2D sampler3D samplerCube sampler1DShadow sampler2DShadow
      samplerCubeShadow sampler1DArray sampler2DArray sampler1DArrayShadow
      sampler2DArrayShadow isampler1D isampler2D isampler3D isamplerCube isampler1DArray
      isampler2DArray usampler1D usampler2D usampler3D usamplerCube usampler1DArray
      usampler2DArray sampler2DRect sampler2DRectShadow isampler2DRect usampler2DRect
      samplerBuffer isamplerBuffer usamplerBuffer sampler2DMS isampler2DMS usampler2DMS
      sampler2DMSArray isampler2DMSArray usampler2DMSArray
    `),
  },
  {
    language: 'GLSL',
    kind: 'a reserved word',
    words: words(`
      coherent volatile restrict readonly writeonly resource atomic_uint patch sample
      subroutine common partition active asm class union enum typedef template this goto
      inline noinline public static extern external interface long short double half
      fixed unsigned superp input output hvec2 hvec3 hvec4 dvec2 dvec3 dvec4 fvec2
      fvec3 fvec4 sampler3DRect filter image1D image2D image3D imageCube iimage1D
      iimage2D iimage3D iimageCube uimage1D uimage2D uimage3D uimageCube image1DArray
      image2DArray iimage1DArray iimage2DArray uimage1DArray uimage2DArray imageBuffer
      iimageBuffer uimageBuffer sizeof cast namespace using shared dmat2 dmat3 dmat4
    `),
  },
  {
    language: 'GLSL',
    kind: 'a built-in function',
    words: words(`
      radians degrees sin cos tan asin acos atan sinh cosh tanh asinh acosh atanh
      pow exp log exp2 log2 sqrt inversesqrt
      abs sign floor trunc round roundEven ceil fract mod modf min max clamp mix step
      smoothstep isnan isinf floatBitsToInt floatBitsToUint intBitsToFloat uintBitsToFloat
      packSnorm2x16 unpackSnorm2x16 packUnorm2x16 unpackUnorm2x16 packHalf2x16 unpackHalf2x16
      length distance dot cross normalize faceforward reflect refract
      matrixCompMult outerProduct transpose determinant inverse
      lessThan lessThanEqual greaterThan greaterThanEqual equal notEqual any all not
      textureSize texture textureProj textureLod textureOffset texelFetch texelFetchOffset
      textureProjOffset textureLodOffset textureProjLod textureProjLodOffset textureGrad
      textureGradOffset textureProjGrad textureProjGradOffset
      dFdx dFdy fwidth
    `),
  },
  { language: 'GLSL', kind: 'the shader entry point', words: ['main'] },
  { language: 'GLSL', kind: 'a predefined macro', words: words('GL_ES GL_FRAGMENT_PRECISION_HIGH') },
];

/** Every group: C, TypeScript and GLSL here, WGSL, HLSL and Rust in reserved-words-targets.ts. */
export const RESERVED_GROUPS: readonly ReservedGroup[] = [...BASE_GROUPS, ...TARGET_RESERVED_GROUPS];
