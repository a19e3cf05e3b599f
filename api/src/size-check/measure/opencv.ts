/**
 * One OpenCV (WebAssembly) runtime per process. The package's module object is a thenable whose
 * `then` never calls back, so `await`ing it (or returning it from an async function) hangs forever:
 * we wait for `onRuntimeInitialized` ourselves and delete `then` before handing the object out.
 */
export type OpenCv = typeof import('@techstark/opencv-js');

let loading: Promise<OpenCv> | null = null;

export function loadOpenCv(): Promise<OpenCv> {
  if (!loading) {
    loading = new Promise<OpenCv>((resolve, reject) => {
      let cv: any;
      try {
        // Required lazily: compiling the 11 MB module costs ~0.3 s that callers without images never pay.
        // eslint-disable-next-line @typescript-eslint/no-require-imports
        cv = require('@techstark/opencv-js');
      } catch (error) {
        reject(error);
        return;
      }
      const ready = () => {
        // Must go before resolve: resolving with a thenable would adopt its never-settling `then`.
        delete cv.then;
        resolve(cv as OpenCv);
      };
      // Another loader (or an earlier require) may already have finished initialising the runtime.
      if (typeof cv.Mat === 'function' && typeof cv.getBuildInformation === 'function') ready();
      else cv.onRuntimeInitialized = ready;
    });
    // A failed load should be retryable rather than cached forever.
    loading.catch(() => {
      loading = null;
    });
  }
  return loading;
}
