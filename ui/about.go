package ui

import (
	_ "embed"

	"github.com/vugu/vugu"
)

// About states the assumptions, the published sources and the cautions,
// on screen and in the printed report.
type About struct{}

// aboutMarkup is the section's content. It never changes, so it is one
// piece of markup rather than elements vugu would build again on every
// render (some 40 of them, and the text between).
//
//go:embed about.html
var aboutMarkup string

// aboutHTML is aboutMarkup as markup for the page, not text to escape.
var aboutHTML = vugu.HTML(aboutMarkup)
