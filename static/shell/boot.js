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

	async function start() {
		if (typeof WebAssembly !== "object" || typeof DecompressionStream !== "function") {
			fail("this browser lacks WebAssembly or DecompressionStream; use a current Chromium, Firefox or Safari.");
			return;
		}
		var holder = document.getElementById("wasm-gz");
		var gz = from85(holder.textContent, Number(holder.getAttribute("data-bytes")));
		var stream = new Blob([gz]).stream().pipeThrough(new DecompressionStream("gzip"));
		var bytes = await new Response(stream).arrayBuffer();
		var go = new Go();
		var result = await WebAssembly.instantiate(bytes, go.importObject);
		// The program's linear memory, read-only, for diagnostics and the
		// browser benchmark (its buffer's byteLength is the wasm heap).
		Object.defineProperty(globalThis, "porelightMemory", {value: result.instance.exports.mem});
		go.run(result.instance).then(function () {
			fail("The solver stopped after an internal error. Reload the page; the last valid inputs are autosaved where the browser allows.");
		});
	}

	start().catch(function (e) {
		fail(String(e && e.message ? e.message : e));
	});
})();
