package solver

// validMonitoring checks the field readings of a project: every problem
// is added to ps with its path (monitoring.plates[0].readings[3].t …).
// height is the column height, m (0 when unknown).
func validMonitoring(ps *Problems, m *Monitoring, height float64) {
}
