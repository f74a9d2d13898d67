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

	function fromBase64(b64) {
		if (Uint8Array.fromBase64) {
			return Uint8Array.fromBase64(b64);
		}
		var bin = atob(b64);
		var out = new Uint8Array(bin.length);
		for (var i = 0; i < bin.length; i++) {
			out[i] = bin.charCodeAt(i);
		}
		return out;
	}

	async function start() {
		if (typeof WebAssembly !== "object" || typeof DecompressionStream !== "function") {
			fail("this browser lacks WebAssembly or DecompressionStream; use a current Chromium, Firefox or Safari.");
			return;
		}
		var gz = fromBase64(document.getElementById("wasm-gz").textContent.trim());
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
