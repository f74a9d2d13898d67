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

	// The gzipped program is written in the 7-bit text code of
	// static/pack.go (Encode122): an ASCII character is a 7-bit chunk of
	// the bits, most significant first; U+0080 + 128·i + d is the unsafe
	// chunk unsafe7[i] followed by the chunk d; U+0300 + i is unsafe7[i]
	// as the last chunk. Line breaks are not data. n is the number of
	// bytes (data-bytes); the padding bits after them must be zero.
	// The browser test TestE2ECode122 runs this function as it stands
	// here, from "function from122" to the closing line marked from122.
	function from122(text, n) {
		var unsafe7 = [0, 10, 13, 38, 60];
		if (!(n >= 0) || n !== Math.floor(n)) {
			throw new Error("the embedded program has no valid byte count (data-bytes)");
		}
		var out = new Uint8Array(n);
		var o = 0, acc = 0, bits = 0, len = text.length, j = 0;
		function damaged(what) {
			return new Error("the embedded program is damaged (" + what + ")");
		}
		for (; j < len; j++) {
			var u = text.charCodeAt(j);
			if (u < 128) {
				if (u === 10) {
					continue; // a line break
				}
				if (u === 0 || u === 13 || u === 38 || u === 60) {
					throw damaged("character " + j);
				}
				acc = (acc << 7) | u;
				bits += 7;
			} else if (u < 768) {
				acc = (acc << 14) | (unsafe7[(u - 128) >> 7] << 7) | (u & 127);
				bits += 14;
			} else if (u < 773) {
				acc = (acc << 7) | unsafe7[u - 768];
				bits += 7;
				for (var k = j + 1; k < len; k++) {
					if (text.charCodeAt(k) !== 10) {
						throw damaged("text after its end, character " + k);
					}
				}
				j = len; // the last chunk: only line breaks may follow
			} else {
				throw damaged("character " + j);
			}
			if (bits >= 8) {
				if (o + (bits >= 16 ? 2 : 1) > n) {
					throw new Error("the embedded program holds more than its " + n + " bytes");
				}
				if (bits >= 16) {
					bits -= 8;
					out[o++] = acc >>> bits;
				}
				bits -= 8;
				out[o++] = acc >>> bits;
				acc &= (1 << bits) - 1;
			}
		}
		if (o < n) {
			throw new Error("the embedded program is truncated (" + o + " of " + n + " bytes)");
		}
		if (bits >= 7 || acc !== 0) {
			throw damaged("its end");
		}
		return out;
	} // from122

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
		// Batches (the Monte Carlo's realisations, op "vary-batch") may
		// use one worker per core: the page's own program only gathers
		// their answers meanwhile.
		pool.wideSize = Math.max(1, Math.min(8, cores));
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
			var slot = {w: null, ready: false, job: null, fails: 0, startedAt: 0, failedAt: 0, memory: 0};
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
				slot.memory = m.memory || 0;
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

		function busyWide() {
			return slots.filter(function (s) {
				return s.job && s.job.wide;
			}).length;
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
					var limit = queue.some(function (j) {
						return j.wide;
					}) ? Math.max(pool.size, pool.wideSize) : pool.size;
					if (!starting && slots.length < limit) {
						spawn();
					}
					return;
				}
				var job = queue.shift();
				if (job.wide && busyWide() >= pool.wideSize) {
					queue.unshift(job); // pool.wideSize caps the workers a batch takes
					return;
				}
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

		// call runs op ("solve", "solve-binary", "validate", "vary-batch" or
		// "vary-solve"; see wasm/worker.go) on payload, a JSON string (or, for
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
				timeout: pool.timeout, settled: false, timer: 0, slot: null, wide: op.indexOf("vary-") === 0
			};
			if (pool.fault) {
				job.op = "fault-" + pool.fault;
				pool.fault = "";
			}
			if (pool.disabled) {
				answer(job, null, pool.disabled);
				return function () {};
			}
			// A solve goes before the batches waiting: an edit is answered
			// while a Monte Carlo runs.
			var at = queue.length;
			if (!job.wide) {
				at = queue.findIndex(function (j) {
					return j.wide;
				});
				if (at < 0) {
					at = queue.length;
				}
			}
			queue.splice(at, 0, job);
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
				calls: pool.calls, restarts: pool.restarts, lastRestartMs: pool.lastRestartMs, disabled: pool.disabled,
				memory: slots.map(function (s) { return s.memory; })
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
		if (!holder || !holder.hasAttribute("data-bytes")) {
			throw new Error("the page holds no embedded program (#wasm-gz with data-bytes)");
		}
		var t0 = performance.now();
		var gz = from122(holder.textContent, Number(holder.getAttribute("data-bytes")));
		// For the browser tests: how long reading the text took.
		performance.measure("porelight: decode program text", {start: t0});
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

	// porelightInView(id) says whether the element with this id is at
	// least partly in view, with a margin of 48 px: inside the window and
	// not scrolled out of a box that clips it. After a solve the page
	// draws the figures in view first (wasm/host.go InView, ui/inview.go).
	Object.defineProperty(globalThis, "porelightInView", {value: function (id) {
		var el = document.getElementById(id);
		if (!el) {
			return false;
		}
		var r = el.getBoundingClientRect();
		var top = r.top, bottom = r.bottom, left = r.left, right = r.right, m = 48;
		for (var p = el.parentElement; p && p !== document.body; p = p.parentElement) {
			if (p.scrollHeight <= p.clientHeight && p.scrollWidth <= p.clientWidth) {
				continue; // nothing scrolled out of it
			}
			var st = getComputedStyle(p);
			if (st.overflowX === "visible" && st.overflowY === "visible") {
				continue;
			}
			var q = p.getBoundingClientRect();
			top = Math.max(top, q.top - m);
			bottom = Math.min(bottom, q.bottom + m);
			left = Math.max(left, q.left - m);
			right = Math.min(right, q.right + m);
		}
		return bottom > top && right > left && bottom > -m && top < innerHeight + m && right > -m && left < innerWidth + m;
	}});

	// Ctrl+Z (⌘Z) undoes the page's last change and Ctrl+Shift+Z or Ctrl+Y
	// redoes, through the Undo and Redo buttons, so that the history has
	// one way in. The page's history holds every keystroke too (a run of
	// them in one input is one step), so the keys work the same in a text
	// field: the browser's own undo there would only know the text the
	// page wrote back into the field.
	document.addEventListener("keydown", function (e) {
		if (!(e.ctrlKey || e.metaKey) || e.altKey || e.isComposing) {
			return;
		}
		var k = (e.key || "").toLowerCase();
		var redo = (k === "z" && e.shiftKey) || (k === "y" && !e.shiftKey);
		if (k !== "z" && !redo) {
			return;
		}
		var id = redo ? "redo" : "undo";
		if (!document.getElementById(id)) {
			return; // the read-only view has no history
		}
		e.preventDefault();
		// The buttons' state is drawn by a render that runs in a task of
		// its own after each change (wasm/coalesce.go): keys pressed in
		// quick succession (Ctrl+Z, then Ctrl+Shift+Z) can come before it,
		// and find Redo still disabled. A disabled button is tried again
		// after the tasks queued now, the pending render among them.
		var tries = 0;
		(function press() {
			var b = document.getElementById(id);
			if (b && !b.disabled) {
				b.click();
			} else if (b && tries++ < 2) {
				setTimeout(press, 0);
			}
		})();
	});

	start().catch(function (e) {
		fail(String(e && e.message ? e.message : e));
	});
})();
