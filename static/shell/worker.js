// Porelight solve worker. The boot script builds each worker from a Blob
// of Go's wasm_exec.js followed by this script, and sends it the compiled
// program once ({type: "init", module}); the program, finding no
// document, registers goCall and calls goReady (wasm/worker.go). Messages
// to the page:
//   {type: "ready"}                              the program is waiting for calls
//   {type: "progress", id, value}                a fraction of call id
//   {type: "reply", id, ok, result|error, memory} the answer (a Uint8Array of JSON)
//   {type: "exit", code, stderr, memory}         the program ended: a crash, or out of memory
//   {type: "initError", error}                   the program could not start
// onmessage is synchronous on purpose: a call holds the worker until it
// is answered, and the page stops a worker that takes too long.
(function () {
	"use strict";

	var go = null;
	var mem = null;
	var stderr = "";
	var decoder = new TextDecoder("utf-8");

	// Keep the start of what the program writes to standard error during
	// a call (Go's runtime begins its report with "fatal error: out of
	// memory" or "panic: …", then dumps every goroutine), and pass it all
	// on to wasm_exec.js, which logs it.
	var fsys = globalThis.fs;
	var write = fsys.writeSync;
	fsys.writeSync = function (fd, buf) {
		if (fd === 2 && stderr.length < 4096) {
			stderr = (stderr + decoder.decode(buf)).slice(0, 4096);
		}
		return write.call(this, fd, buf);
	};

	function memory() {
		return mem ? mem.buffer.byteLength : 0;
	}

	self.onmessage = function (e) {
		var m = e.data;
		if (m.type === "init") {
			go = new Go();
			go.exit = function (code) {
				self.postMessage({type: "exit", code: code, stderr: stderr, memory: memory()});
			};
			self.goReady = function () {
				self.postMessage({type: "ready"});
			};
			WebAssembly.instantiate(m.module, go.importObject).then(function (inst) {
				mem = inst.exports.mem;
				go.run(inst);
			}).catch(function (err) {
				self.postMessage({type: "initError", error: String(err && err.message ? err.message : err)});
			});
			return;
		}
		if (m.type !== "call") {
			return;
		}
		var id = m.id;
		var progress = function (f) {
			self.postMessage({type: "progress", id: id, value: f});
		};
		var r;
		stderr = "";
		try {
			r = self.goCall(m.op, m.payload, progress);
		} catch (err) {
			self.postMessage({type: "reply", id: id, ok: false, error: String(err && err.message ? err.message : err)});
			return;
		}
		if (go.exited || !(r instanceof Uint8Array)) {
			// The exit message has gone first and says why.
			self.postMessage({type: "reply", id: id, ok: false, error: "the solver program has ended"});
			return;
		}
		self.postMessage({type: "reply", id: id, ok: true, result: r, memory: memory()}, [r.buffer]);
	};
})();
