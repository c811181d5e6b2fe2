/**
 * The helper thread of MatrixProductThread (matrix-products.ts): computes its share of A·x
 * (a range of A's rows) and of Aᵀ·u (a range of Aᵀ's rows) while the calling thread does the
 * rest. It waits on shared memory rather than on messages, because LSQR calls it twice per
 * iteration, hundreds of times per second; a new matrix arrives as a message read synchronously.
 * Runs as one long task on a one-thread pool (the pool's threads load TypeScript as the other
 * pools' do), from start until the stop command.
 */
import { receiveMessageOnPort, type MessagePort } from 'node:worker_threads';
import { COMMAND, CONTROL, type ProductBuffers } from './product-protocol';

export interface ProductThreadTask {
  control: SharedArrayBuffer;
  port: MessagePort;
}

function multiplyRows(ptr: Int32Array, cols: Int32Array, vals: Float32Array, x: Float64Array, out: Float64Array, from: number, to: number): void {
  for (let r = from; r < to; r++) {
    let sum = 0;
    for (let k = ptr[r], end = ptr[r + 1]; k < end; k++) sum += vals[k] * x[cols[k]];
    out[r] = sum;
  }
}

export default function serve(task: ProductThreadTask): void {
  const control = new Int32Array(task.control);
  let b: ProductBuffers | null = null;
  Atomics.store(control, CONTROL.ready, 1);
  Atomics.notify(control, CONTROL.ready);
  // From 0, not from the current value: a command posted before this thread got here is not missed.
  let seen = 0;
  for (;;) {
    Atomics.wait(control, CONTROL.generation, seen);
    seen = Atomics.load(control, CONTROL.generation);
    const command = Atomics.load(control, CONTROL.command);
    if (command === COMMAND.stop) break;
    if (command === COMMAND.load) {
      b = receiveMessageOnPort(task.port)!.message as ProductBuffers;
    } else if (b && command === COMMAND.multiply) {
      multiplyRows(b.ptr, b.cols, b.vals, b.x, b.rowsOut, b.rowSplit, b.rows);
    } else if (b && command === COMMAND.transpose) {
      multiplyRows(b.tPtr, b.tCols, b.tVals, b.u, b.colsOut, b.colSplit, b.columns);
    }
    Atomics.store(control, CONTROL.done, seen);
    Atomics.notify(control, CONTROL.done);
  }
  Atomics.store(control, CONTROL.done, seen);
  Atomics.notify(control, CONTROL.done);
  task.port.close();
}
