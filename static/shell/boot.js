// Porelight boot: unpack the inline, gzipped WebAssembly and start it.
// Everything the page needs is inside the page; nothing is fetched.
(function () {
	"use strict";

	var text = document.getElementById("loading-text");

	function fail(msg) {
		if (text && text.isConnected) {
			text.textContent = "The page could not start: " + msg;
			text.parentNode.classList.add("pl-loading-failed");
			return;
		}
		var bar = document.createElement("p");
		bar.id = "fatal";
		bar.className = "pl-fatal";
		bar.setAttribute("role", "alert");
		bar.textContent = msg;
		document.body.insertBefore(bar, document.body.firstChild);
	}

	// The renderer evaluates its helper script when it starts. The page
	// carries that script inline (#vugu-helper, already run), so the call
	// is answered here and the page needs no 'unsafe-eval'.
	var helperMark = "(function(){if(window.vuguRender)return;";
	var realEval = window.eval;
	window.eval = function (src) {
		if (typeof src === "string" && src.indexOf(helperMark) === 0 && window.vuguRender) {
			return undefined;
		}
		return realEval(src);
	};

	// The gzipped program is written in base 85 (static/pack.go, Encode85):
	// 5 digits of the alphabet below hold 4 bytes, most significant first.
	var alphabet85 = "!#$%()*+,-./0123456789:;=?@ABCDEFGHIJKLMNOPQRSTUVWXYZ[]^_abcdefghijklmnopqrstuvwxyz|~";
	function from85(text, n) {
		var idx = new Int16Array(128).fill(-1);
		for (var i = 0; i < alphabet85.length; i++) {
			idx[alphabet85.charCodeAt(i)] = i;
		}
		var out = new Uint8Array(Math.ceil(text.length / 5) * 4);
		var o = 0, v = 0, k = 0;
		for (var j = 0; j < text.length; j++) {
			var c = text.charCodeAt(j);
			if (c <= 32) {
				continue; // white space from line wrapping
			}
			var d = c < 128 ? idx[c] : -1;
			if (d < 0) {
				throw new Error("the embedded program is damaged (character " + j + ")");
			}
			v = v * 85 + d;
			if (++k === 5) {
				out[o++] = v >>> 24;
				out[o++] = (v >>> 16) & 255;
				out[o++] = (v >>> 8) & 255;
				out[o++] = v & 255;
				v = 0;
				k = 0;
			}
		}
		if (k !== 0 || o < n) {
			throw new Error("the embedded program is truncated");
		}
		return out.subarray(0, n);
	}

	// Problem-shaped answers, as porelight.solve gives for a bad project.
	var encoder = new TextEncoder();
	function errorJSON(message) {
		return JSON.stringify({error: {problems: [{path: "", message: message}]}});
	}
	var reduce = "reduce the number of elements (mesh.maxSize) or of output times";
	function crashMessage(stderr) {
		if (/out of memory/i.test(stderr)) {
			return "this solve ran out of memory — " + reduce;
		}
		var line = (stderr.match(/(panic|fatal error)[^\n]*/) || [""])[0].slice(0, 200);
		return "the solver stopped on an internal error" + (line ? " (" + line + ")" : "") +
			"; a fresh solver has taken over, so change an input to try again";
	}

	// Workers is the pool of solve workers: each runs the same program
	// (the compiled module is shared) behind static/shell/worker.js. A
	// worker that crashes, runs out of memory, takes longer than
	// pool.timeout or is cancelled is terminated and replaced by a fresh
	// one; the page's own program is never touched. Where the browser
	// refuses workers, pool.disabled says why and calls answer "no
	// worker", so that callers solve in the page.
	function Workers(module, url) {
		var pool = this;
		var cores = navigator.hardwareConcurrency || 2;
		pool.size = Math.max(1, Math.min(4, cores - 1));
		pool.timeout = 300000; // ms; tests lower it
		pool.recycleBytes = 256 * 1024 * 1024; // a worker whose memory grew past this is replaced
		pool.fault = ""; // tests: "oom", "hang" or "panic" makes the next call's worker fail so
		pool.disabled = "";
		pool.restarts = 0; // workers replaced after a crash, a timeout or a cancel
		pool.lastRestartMs = 0; // from the failure to the fresh worker's ready message
		pool.calls = 0;
		var slots = [];
		var queue = [];
		var nextID = 1;

		function start(slot) {
			slot.ready = false;
			slot.startedAt = performance.now();
			try {
				slot.w = new Worker(url);
			} catch (e) {
				disable("the browser refused a worker: " + (e && e.message ? e.message : e));
				return;
			}
			var w = slot.w;
			w.onmessage = function (e) {
				if (slot.w === w) {
					message(slot, e.data);
				}
			};
			w.onerror = function (e) {
				e.preventDefault();
				if (slot.w === w) {
					fault(slot, e.message ? "the solver worker failed: " + e.message : "the solver worker failed");
				}
			};
			w.onmessageerror = function () {
				if (slot.w === w) {
					fault(slot, "a message from the solver worker could not be read");
				}
			};
			w.postMessage({type: "init", module: module});
		}

		function spawn() {
			var slot = {w: null, ready: false, job: null, fails: 0, startedAt: 0, failedAt: 0};
			slots.push(slot);
			start(slot);
		}

		function disable(why) {
			pool.disabled = why;
			slots.forEach(function (s) {
				if (s.w) {
					s.w.terminate();
				}
				s.w = null;
			});
			var pending = queue.splice(0);
			slots.forEach(function (s) {
				if (s.job) {
					pending.push(s.job);
					s.job = null;
				}
			});
			pending.forEach(function (job) {
				answer(job, null, why);
			});
		}

		// answer settles job once; nothing of it is called again.
		function answer(job, bytes, noWorker) {
			if (job.settled) {
				return;
			}
			job.settled = true;
			clearTimeout(job.timer);
			try {
				job.onDone(bytes, noWorker || "");
			} catch (e) {
				console.error(e);
			}
		}

		function answerError(job, msg) {
			answer(job, encoder.encode(errorJSON(msg)), "");
		}

		// restart replaces the slot's worker; failed says it was for a
		// failure or a cancel (counted in pool.restarts).
		function restart(slot, failed) {
			if (slot.w) {
				slot.w.terminate();
			}
			slot.w = null;
			if (failed) {
				slot.failedAt = performance.now();
				pool.restarts++;
			}
			start(slot);
		}

		// fault handles a worker that is gone or stuck: its call, if any,
		// is answered with msg, and a fresh worker takes its place.
		function fault(slot, msg) {
			var job = slot.job;
			slot.job = null;
			if (!slot.ready && !job) {
				// It failed while starting: give up after a few tries.
				if (++slot.fails >= 3) {
					disable("the solver worker would not start: " + msg);
					return;
				}
			}
			if (job) {
				answerError(job, msg);
			}
			restart(slot, true);
			dispatch();
		}

		function message(slot, m) {
			var job = slot.job;
			switch (m.type) {
			case "ready":
				slot.ready = true;
				slot.fails = 0;
				if (slot.failedAt) {
					pool.lastRestartMs = performance.now() - slot.failedAt;
					slot.failedAt = 0;
				}
				dispatch();
				break;
			case "progress":
				if (job && job.id === m.id && job.onProgress && !job.settled) {
					try {
						job.onProgress(m.value);
					} catch (e) {
						console.error(e);
					}
				}
				break;
			case "reply":
				if (!job || job.id !== m.id) {
					break;
				}
				slot.job = null;
				if (m.ok) {
					answer(job, m.result, "");
				} else {
					answerError(job, "the solver failed: " + m.error);
				}
				if (m.memory > pool.recycleBytes) {
					restart(slot, false); // memory never shrinks: start afresh
				}
				dispatch();
				break;
			case "exit":
				fault(slot, crashMessage(m.stderr || ""));
				break;
			case "initError":
				fault(slot, "the solver could not start: " + m.error);
				break;
			}
		}

		function dispatch() {
			while (queue.length > 0 && !pool.disabled) {
				var slot = null;
				for (var i = 0; i < slots.length; i++) {
					if (slots[i].ready && !slots[i].job) {
						slot = slots[i];
						break;
					}
				}
				if (!slot) {
					var starting = slots.some(function (s) {
						return !s.ready;
					});
					if (!starting && slots.length < pool.size) {
						spawn();
					}
					return;
				}
				var job = queue.shift();
				slot.job = job;
				job.slot = slot;
				job.timer = setTimeout(function (s, j) {
					if (s.job === j) {
						fault(s, "this solve took longer than " + Math.round(j.timeout / 1000) +
							" s and was stopped — " + reduce + ", or of time steps (stepping)");
					}
				}, job.timeout, slot, job);
				slot.w.postMessage({type: "call", id: job.id, op: job.op, payload: job.payload});
			}
		}

		// call runs op ("solve", "solve-binary" or "validate"; see
		// wasm/worker.go) on payload, a JSON string (or, for
		// "solve-binary", a Uint8Array of a binary project),
		// in a worker. onDone(bytes, noWorker) is called once: bytes is a
		// Uint8Array of the answer (JSON, or a binary result for "solve-binary"), or noWorker says why no worker
		// could run it. onProgress, if given, receives fractions of a
		// solve. The returned function cancels the call: onDone is then
		// never called, and a worker running it is replaced.
		pool.call = function (op, payload, onProgress, onDone) {
			pool.calls++;
			var job = {
				id: nextID++, op: op, payload: payload instanceof Uint8Array ? payload : String(payload), onProgress: onProgress, onDone: onDone,
				timeout: pool.timeout, settled: false, timer: 0, slot: null
			};
			if (pool.fault) {
				job.op = "fault-" + pool.fault;
				pool.fault = "";
			}
			if (pool.disabled) {
				answer(job, null, pool.disabled);
				return function () {};
			}
			queue.push(job);
			dispatch();
			return function cancel() {
				if (job.settled) {
					return;
				}
				job.settled = true;
				clearTimeout(job.timer);
				var i = queue.indexOf(job);
				if (i >= 0) {
					queue.splice(i, 1);
				} else if (job.slot && job.slot.job === job) {
					job.slot.job = null;
					restart(job.slot, true);
					dispatch();
				}
			};
		};

		// stats are for tests and diagnostics.
		pool.stats = function () {
			return {
				workers: slots.length, ready: slots.filter(function (s) { return s.ready; }).length,
				busy: slots.filter(function (s) { return !!s.job; }).length, queued: queue.length,
				calls: pool.calls, restarts: pool.restarts, lastRestartMs: pool.lastRestartMs, disabled: pool.disabled
			};
		};

		if (typeof Worker !== "function") {
			pool.disabled = "this browser has no Web Workers";
		} else {
			spawn(); // ready before the first solve
		}
	}

	// solveAsync is porelight.solveAsync: the project (JSON text or an
	// object) solved in a worker. The promise resolves with what
	// porelight.solve would return (an error object for a bad project, a
	// crash or a timeout) and never rejects. Without workers it solves in
	// the page.
	function solveAsync(pool, project) {
		return new Promise(function (resolve) {
			var text;
			try {
				if (typeof project === "string") {
					text = project;
				} else if (project !== null && typeof project === "object") {
					text = JSON.stringify(project);
				} else {
					resolve(errorJSON("pass the project as a JSON string or an object (got " + (project === null ? "null" : typeof project) + ")"));
					return;
				}
			} catch (e) {
				resolve(errorJSON("the project object could not be turned into JSON: " + (e && e.message ? e.message : e)));
				return;
			}
			var inPage = function () {
				try {
					resolve(String(globalThis.porelight.solve(text)));
				} catch (e) {
					resolve(errorJSON("the solver has stopped; reload the page (" + (e && e.message ? e.message : e) + ")"));
				}
			};
			try {
				pool.call("solve", text, null, function (bytes, noWorker) {
					if (noWorker) {
						inPage();
						return;
					}
					try {
						resolve(new TextDecoder("utf-8").decode(bytes));
					} catch (e) {
						resolve(errorJSON("the answer could not be read: " + (e && e.message ? e.message : e)));
					}
				});
			} catch (e) {
				inPage();
			}
		});
	}

	async function start() {
		if (typeof WebAssembly !== "object" || typeof DecompressionStream !== "function") {
			fail("this browser lacks WebAssembly or DecompressionStream; use a current Chromium, Firefox or Safari.");
			return;
		}
		var holder = document.getElementById("wasm-gz");
		var gz = from85(holder.textContent, Number(holder.getAttribute("data-bytes")));
		var stream = new Blob([gz]).stream().pipeThrough(new DecompressionStream("gzip"));
		var bytes = await new Response(stream).arrayBuffer();
		// Compiled once: the page and every worker instantiate this module.
		var module = await WebAssembly.compile(bytes);
		// A worker's script: wasm_exec.js, then the shim. The URL is never
		// revoked: new workers are made from it after a crash.
		var url = URL.createObjectURL(new Blob([
			document.getElementById("wasm-exec").textContent, "\n",
			document.getElementById("worker-shim").textContent
		], {type: "text/javascript"}));
		var pool = new Workers(module, url);
		Object.defineProperty(globalThis, "porelightWorkers", {value: pool});
		var go = new Go();
		var instance = await WebAssembly.instantiate(module, go.importObject);
		// The program's linear memory, read-only, for diagnostics and the
		// browser benchmark (its buffer's byteLength is the wasm heap).
		Object.defineProperty(globalThis, "porelightMemory", {value: instance.exports.mem});
		go.run(instance).then(function () {
			fail("The solver stopped after an internal error. Reload the page; the last valid inputs are autosaved where the browser allows.");
		});
		// main has registered the API by now (it runs until it first waits).
		if (globalThis.porelight) {
			globalThis.porelight.solveAsync = function (project) {
				return solveAsync(pool, project);
			};
		}
	}

	start().catch(function (e) {
		fail(String(e && e.message ? e.message : e));
	});
})();
