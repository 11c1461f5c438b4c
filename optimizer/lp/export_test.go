package lp

// ProcessCPU exposes processCPU to the external test package.
var ProcessCPU = processCPU
