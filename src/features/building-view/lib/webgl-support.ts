export interface WebglSupport {
  available: boolean;
  /** Rendered on the CPU (SwiftShader, llvmpipe): antialiasing is left off there, it costs a lot. */
  software: boolean;
}

const SOFTWARE = /swiftshader|llvmpipe|software|softpipe/i;

/** Whether this browser gives a WebGL context (WebGL 2 or 1); headless or locked-down browsers may not. */
export function webglSupport(): WebglSupport {
  try {
    const canvas = document.createElement('canvas');
    const gl = (canvas.getContext('webgl2') ?? canvas.getContext('webgl')) as WebGLRenderingContext | null;
    if (!gl) return { available: false, software: false };
    const info = gl.getExtension('WEBGL_debug_renderer_info');
    const renderer = info ? String(gl.getParameter(info.UNMASKED_RENDERER_WEBGL)) : String(gl.getParameter(gl.RENDERER));
    gl.getExtension('WEBGL_lose_context')?.loseContext();
    return { available: true, software: SOFTWARE.test(renderer) };
  } catch {
    return { available: false, software: false };
  }
}
