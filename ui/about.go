package ui

// About states the assumptions, the published sources and the cautions,
// on screen and in the printed report.
type About struct{}
