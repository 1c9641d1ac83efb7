/**
 * Words a spec may not use as a name because the WGSL, HLSL or Rust code would
 * fail to compile or mean something else (joined to the C, TypeScript and GLSL
 * groups in reserved-words.ts). Written FROM MEMORY of these documents, then
 * checked against the compilers themselves (test/reader/reserved-words-targets.test.ts:
 * Chromium's WGSL compiler, glslang's HLSL front end and rustc):
 * - WGSL: the W3C WebGPU Shading Language specification, "Keyword Summary"
 *   and "Reserved Words", plus its predeclared types and the built-in
 *   functions the generated code calls (a user declaration would shadow them);
 * - HLSL: Microsoft's "Keywords" page of the HLSL reference (learn.microsoft.com),
 *   the scalar, vector and matrix type names, and the intrinsics the
 *   generated code calls;
 * - Rust: The Rust Reference, "Keywords" (strict and reserved keywords; `gen`
 *   is reserved from the 2024 edition on).
 */
import type { ReservedGroup } from './reserved-words.js';

const words = (s: string): readonly string[] => s.trim().split(/\s+/);

const vectors = (bases: readonly string[]): string[] => bases.flatMap((b) => [1, 2, 3, 4].map((n) => `${b}${n}`));
const matrices = (bases: readonly string[]): string[] =>
  bases.flatMap((b) => [1, 2, 3, 4].flatMap((r) => [1, 2, 3, 4].map((c) => `${b}${r}x${c}`)));

export const TARGET_RESERVED_GROUPS: readonly ReservedGroup[] = [
  {
    language: 'WGSL',
    kind: 'a keyword',
    words: words(`
      alias break case const const_assert continue continuing default diagnostic discard
      else enable false fn for if let loop override requires return struct switch true var while
    `),
  },
  {
    language: 'WGSL',
    kind: 'a reserved word',
    words: words(`
      NULL Self abstract active alignas alignof as asm asm_fragment async attribute auto
      await become cast catch class co_await co_return co_yield coherent
      column_major common compile compile_fragment concept const_cast consteval constexpr
      constinit crate debugger decltype delete demote demote_to_helper do dynamic_cast enum
      explicit export extends extern external fallthrough filter final finally friend from
      fxgroup get goto groupshared highp impl implements import inline instanceof interface
      layout lowp macro macro_rules match mediump meta mod module move mut mutable namespace
      new nil noexcept noinline nointerpolation noperspective null nullptr of operator
      package packoffset partition pass patch pixelfragment precise precision premerge priv
      protected pub public readonly ref regardless register reinterpret_cast require
      resource restrict self set shared sizeof smooth snorm static static_assert static_cast
      std subroutine super target template this thread_local throw trait try type typedef
      typeid typename typeof union unless unorm unsafe unsized use using varying virtual
      volatile wgsl where with writeonly yield
    `),
  },
  {
    language: 'WGSL',
    kind: 'a predeclared type',
    words: words(`
      bool f16 f32 i32 u32 vec2 vec3 vec4 mat2x2 mat2x3 mat2x4 mat3x2 mat3x3 mat3x4
      mat4x2 mat4x3 mat4x4 array atomic ptr sampler sampler_comparison binding_array
      vec2f vec3f vec4f vec2i vec3i vec4i vec2u vec3u vec4u vec2h vec3h vec4h
    `),
  },
  {
    language: 'WGSL',
    kind: 'a built-in function',
    words: words('round clamp select bitcast arrayLength'),
  },
  {
    language: 'HLSL',
    kind: 'a keyword',
    words: words(`
      AppendStructuredBuffer asm asm_fragment BlendState bool break Buffer ByteAddressBuffer
      case cbuffer centroid class column_major compile compile_fragment CompileShader const
      continue ComputeShader ConsumeStructuredBuffer default DepthStencilState
      DepthStencilView discard do double DomainShader dword else export extern false float
      for fxgroup GeometryShader groupshared half Hullshader if in inline inout InputPatch
      int interface line lineadj linear LineStream matrix min16float min10float min16int
      min12int min16uint namespace nointerpolation noperspective NULL out OutputPatch
      packoffset pass pixelfragment PixelShader point PointStream precise RasterizerState
      RenderTargetView return register row_major RWBuffer RWByteAddressBuffer
      RWStructuredBuffer RWTexture1D RWTexture1DArray RWTexture2D RWTexture2DArray
      RWTexture3D sample sampler SamplerState SamplerComparisonState shared snorm
      stateblock stateblock_state static string struct switch StructuredBuffer tbuffer
      technique technique10 technique11 texture Texture1D Texture1DArray Texture2D
      Texture2DArray Texture2DMS Texture2DMSArray Texture3D TextureCube TextureCubeArray
      true typedef triangle triangleadj TriangleStream uint uniform unorm unsigned vector
      vertexfragment VertexShader void volatile while
    `),
  },
  {
    language: 'HLSL',
    kind: 'a vector or matrix type',
    words: [...vectors(['float', 'int', 'uint', 'bool', 'half', 'double']), ...matrices(['float', 'int', 'uint', 'half', 'double'])],
  },
  {
    language: 'HLSL',
    kind: 'an intrinsic function',
    words: words('asuint asint asfloat round clamp'),
  },
  {
    language: 'Rust',
    kind: 'a keyword',
    words: words(`
      as break const continue crate else enum extern false fn for if impl in let loop match
      mod move mut pub ref return self Self static struct super trait true type unsafe use
      where while async await dyn
    `),
  },
  {
    language: 'Rust',
    kind: 'a reserved keyword',
    words: words('abstract become box do final macro override priv typeof unsized virtual yield try gen'),
  },
];
