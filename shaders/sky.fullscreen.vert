// sky.fullscreen.vert — one triangle pair covering the frame; all work is per pixel in the fragment shaders.
// Uniforms: none. Attributes: position (clip-space x, y of a 2 x 2 plane).
// Mirrors: nothing in lib/ (lib/render loops over pixels instead).
precision highp float;
in vec3 position;
void main() {
  gl_Position = vec4(position.xy, 0.0, 1.0);
}
