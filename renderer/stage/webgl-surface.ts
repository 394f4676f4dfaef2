import type { Rgb, StageSurface } from './surface';

const quadVertex = `#version 300 es
in vec2 corner;
uniform vec4 rect;     // left, top, width, height in canvas pixels
uniform vec2 canvas;   // canvas size
out vec2 uv;
void main() {
  vec2 px = rect.xy + corner * rect.zw;
  uv = corner;
  gl_Position = vec4(px.x / canvas.x * 2.0 - 1.0, 1.0 - px.y / canvas.y * 2.0, 0.0, 1.0);
}`;

const imageFragment = `#version 300 es
precision mediump float;
in vec2 uv;
uniform sampler2D image;
out vec4 colour;
void main() { colour = texture(image, uv); }`;

const discFragment = `#version 300 es
precision mediump float;
in vec2 uv;
uniform vec3 fill;
out vec4 colour;
void main() {
  if (length(uv - 0.5) > 0.5) discard;
  colour = vec4(fill, 1.0);
}`;

function program(gl: WebGL2RenderingContext, fragment: string): WebGLProgram {
  const compile = (type: number, source: string) => {
    const shader = gl.createShader(type)!;
    gl.shaderSource(shader, source);
    gl.compileShader(shader);
    if (!gl.getShaderParameter(shader, gl.COMPILE_STATUS)) throw new Error(`stage shader: ${gl.getShaderInfoLog(shader)}`);
    return shader;
  };
  const p = gl.createProgram()!;
  gl.attachShader(p, compile(gl.VERTEX_SHADER, quadVertex));
  gl.attachShader(p, compile(gl.FRAGMENT_SHADER, fragment));
  gl.bindAttribLocation(p, 0, 'corner');
  gl.linkProgram(p);
  if (!gl.getProgramParameter(p, gl.LINK_STATUS)) throw new Error(`stage program: ${gl.getProgramInfoLog(p)}`);
  return p;
}

/**
 * The WebGL2 surface: the event image is uploaded as a texture each frame and drawn with
 * nearest-neighbour sampling into its placement rectangle; discs are drawn by a shader.
 */
export function webglSurface(canvas: HTMLCanvasElement, gl: WebGL2RenderingContext): StageSurface {
  const imageProgram = program(gl, imageFragment);
  const discProgram = program(gl, discFragment);
  const corners = gl.createBuffer();
  gl.bindBuffer(gl.ARRAY_BUFFER, corners);
  gl.bufferData(gl.ARRAY_BUFFER, new Float32Array([0, 0, 1, 0, 0, 1, 1, 1]), gl.STATIC_DRAW);
  gl.enableVertexAttribArray(0);
  gl.vertexAttribPointer(0, 2, gl.FLOAT, false, 0, 0);
  const texture = gl.createTexture();
  gl.bindTexture(gl.TEXTURE_2D, texture);
  gl.texParameteri(gl.TEXTURE_2D, gl.TEXTURE_MIN_FILTER, gl.NEAREST);
  gl.texParameteri(gl.TEXTURE_2D, gl.TEXTURE_MAG_FILTER, gl.NEAREST);
  gl.texParameteri(gl.TEXTURE_2D, gl.TEXTURE_WRAP_S, gl.CLAMP_TO_EDGE);
  gl.texParameteri(gl.TEXTURE_2D, gl.TEXTURE_WRAP_T, gl.CLAMP_TO_EDGE);
  let textureSize = { width: 0, height: 0 };

  const locations = new Map<WebGLProgram, { rect: WebGLUniformLocation | null; canvas: WebGLUniformLocation | null; fill: WebGLUniformLocation | null }>();
  for (const p of [imageProgram, discProgram]) {
    locations.set(p, { rect: gl.getUniformLocation(p, 'rect'), canvas: gl.getUniformLocation(p, 'canvas'), fill: gl.getUniformLocation(p, 'fill') });
  }
  const drawQuad = (p: WebGLProgram, left: number, top: number, width: number, height: number) => {
    const at = locations.get(p)!;
    gl.useProgram(p);
    gl.uniform4f(at.rect, left, top, width, height);
    gl.uniform2f(at.canvas, canvas.width, canvas.height);
    gl.drawArrays(gl.TRIANGLE_STRIP, 0, 4);
  };
  const clearTo = ([r, g, b]: Rgb) => {
    gl.clearColor(r / 255, g / 255, b / 255, 1);
    gl.clear(gl.COLOR_BUFFER_BIT);
  };

  return {
    kind: 'webgl2',
    canvas,
    resize(width, height) {
      canvas.width = width;
      canvas.height = height;
      gl.viewport(0, 0, width, height);
    },
    clear(colour) {
      gl.disable(gl.SCISSOR_TEST);
      clearTo(colour);
    },
    fillRect(x, y, width, height, colour) {
      // Screen coordinates have y down; GL's scissor box has y up.
      gl.enable(gl.SCISSOR_TEST);
      gl.scissor(Math.round(x), Math.round(canvas.height - y - height), Math.round(width), Math.round(height));
      clearTo(colour);
      gl.disable(gl.SCISSOR_TEST);
    },
    fillDisc(cx, cy, radius, [r, g, b]) {
      gl.useProgram(discProgram);
      gl.uniform3f(locations.get(discProgram)!.fill, r / 255, g / 255, b / 255);
      drawQuad(discProgram, cx - radius, cy - radius, radius * 2, radius * 2);
    },
    drawImage(rgba, w, h, into) {
      gl.bindTexture(gl.TEXTURE_2D, texture);
      const pixels = new Uint8Array(rgba.buffer, rgba.byteOffset, rgba.byteLength);
      if (textureSize.width !== w || textureSize.height !== h) {
        gl.texImage2D(gl.TEXTURE_2D, 0, gl.RGBA8, w, h, 0, gl.RGBA, gl.UNSIGNED_BYTE, pixels);
        textureSize = { width: w, height: h };
      } else {
        gl.texSubImage2D(gl.TEXTURE_2D, 0, 0, 0, w, h, gl.RGBA, gl.UNSIGNED_BYTE, pixels);
      }
      drawQuad(imageProgram, into.left, into.top, into.width, into.height);
    },
  };
}
