/**
 * Runs fragment shaders of our own on WebGL2 in headless Chromium
 * (playwright-core, SwiftShader, launched as src/verify/glsl/browser.ts does)
 * and returns the raw bits of what they wrote, so a test can look at values
 * the emitted page does not print (a segment number, a NaN's bits).
 *
 * Each shader gets the same input points: input j of the four points of
 * texel x sits in texel (x, j) of one RGBA32F texture, handed over as
 * binary32 bit patterns so NaN, infinities, -0 and subnormals reach the GPU
 * untouched; each shader writes four results per texel into an RGBA32F
 * target, read back with readPixels and returned as bit patterns.
 */
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { CHROMIUM_ARGS, chromiumPath } from '../../../src/verify/glsl/browser.js';

/** The shader's main() sees `rc_a0 ... rc_a<d-1>` (vec4, four points) and must write `rc_out`. */
export function fragmentShader(snippets: readonly string[], inputs: number, body: string): string {
  return [
    '#version 300 es',
    'precision highp float;',
    'precision highp int;',
    'precision highp sampler2D;',
    ...snippets,
    'uniform highp sampler2D rc_in;',
    'out highp vec4 rc_out;',
    'void main() {',
    '  int rc_x = int(gl_FragCoord.x);',
    ...Array.from({ length: inputs }, (_, j) => `  vec4 rc_a${j} = texelFetch(rc_in, ivec2(rc_x, ${j}), 0);`),
    `  ${body}`,
    '}',
    '',
  ].join('\n');
}

export interface ShaderBrowser {
  /** Every shader on every point: result[s][k] is shader s's output bits at point k. */
  run(shaders: readonly string[], points: readonly (readonly number[])[]): Promise<number[][]>;
  close(): Promise<void>;
}

/** Starts Chromium once; `profile` is a fresh empty directory (TOOLCHAIN.md: passed as the first argument). */
export async function openShaderBrowser(profile: string): Promise<ShaderBrowser> {
  const context: BrowserContext = await chromium.launchPersistentContext(profile, { executablePath: chromiumPath(), headless: true, args: [...CHROMIUM_ARGS] });
  const page: Page = await context.newPage();
  await page.setContent('<!DOCTYPE html><title>rootcast shader run</title>');
  return {
    async run(shaders, points) {
      const f32 = new Float32Array(1);
      const u32 = new Uint32Array(f32.buffer);
      const bitsOf = (v: number): number => {
        f32[0] = v;
        return u32[0]!;
      };
      const d = points[0]?.length ?? 0;
      const inputBits = points.map((p) => p.map(bitsOf));
      return page.evaluate(
        ({ shaders, inputBits, d }) => {
          const gl = document.createElement('canvas').getContext('webgl2');
          if (!gl) throw new Error('no WebGL2');
          if (!gl.getExtension('EXT_color_buffer_float')) throw new Error('no EXT_color_buffer_float');
          const compile = (type: number, source: string): WebGLShader => {
            const s = gl.createShader(type)!;
            gl.shaderSource(s, source);
            gl.compileShader(s);
            if (!gl.getShaderParameter(s, gl.COMPILE_STATUS)) throw new Error(`shader did not compile: ${gl.getShaderInfoLog(s)}\n${source}`);
            return s;
          };
          const vertex = compile(gl.VERTEX_SHADER, '#version 300 es\nvoid main() {\n  vec2 p = vec2(float((gl_VertexID << 1) & 2), float(gl_VertexID & 2));\n  gl_Position = vec4(p * 2.0 - 1.0, 0.0, 1.0);\n}\n');
          const n = inputBits.length;
          const width = Math.max(1, Math.ceil(n / 4));
          const data = new Uint32Array(width * 4 * d);
          inputBits.forEach((p, k) => p.forEach((b, j) => (data[j * width * 4 + k] = b)));
          const input = gl.createTexture();
          gl.activeTexture(gl.TEXTURE0);
          gl.bindTexture(gl.TEXTURE_2D, input);
          gl.texImage2D(gl.TEXTURE_2D, 0, gl.RGBA32F, width, d, 0, gl.RGBA, gl.FLOAT, new Float32Array(data.buffer));
          gl.texParameteri(gl.TEXTURE_2D, gl.TEXTURE_MIN_FILTER, gl.NEAREST);
          gl.texParameteri(gl.TEXTURE_2D, gl.TEXTURE_MAG_FILTER, gl.NEAREST);
          const target = gl.createTexture();
          gl.activeTexture(gl.TEXTURE1);
          gl.bindTexture(gl.TEXTURE_2D, target);
          gl.texImage2D(gl.TEXTURE_2D, 0, gl.RGBA32F, width, 1, 0, gl.RGBA, gl.FLOAT, null);
          gl.texParameteri(gl.TEXTURE_2D, gl.TEXTURE_MIN_FILTER, gl.NEAREST);
          gl.texParameteri(gl.TEXTURE_2D, gl.TEXTURE_MAG_FILTER, gl.NEAREST);
          const fb = gl.createFramebuffer();
          gl.bindFramebuffer(gl.FRAMEBUFFER, fb);
          gl.framebufferTexture2D(gl.FRAMEBUFFER, gl.COLOR_ATTACHMENT0, gl.TEXTURE_2D, target, 0);
          if (gl.checkFramebufferStatus(gl.FRAMEBUFFER) !== gl.FRAMEBUFFER_COMPLETE) throw new Error('an RGBA32F render target is not complete');
          gl.viewport(0, 0, width, 1);
          return shaders.map((source) => {
            const program = gl.createProgram()!;
            gl.attachShader(program, vertex);
            gl.attachShader(program, compile(gl.FRAGMENT_SHADER, source));
            gl.linkProgram(program);
            if (!gl.getProgramParameter(program, gl.LINK_STATUS)) throw new Error(`shader did not link: ${gl.getProgramInfoLog(program)}`);
            gl.useProgram(program);
            gl.uniform1i(gl.getUniformLocation(program, 'rc_in'), 0);
            gl.drawArrays(gl.TRIANGLES, 0, 3);
            const pixels = new Float32Array(width * 4);
            gl.readPixels(0, 0, width, 1, gl.RGBA, gl.FLOAT, pixels);
            const err = gl.getError();
            if (err !== gl.NO_ERROR) throw new Error(`WebGL error ${err}`);
            return Array.from(new Uint32Array(pixels.buffer).subarray(0, n));
          });
        },
        { shaders: [...shaders], inputBits, d },
      );
    },
    async close() {
      await context.close();
    },
  };
}
