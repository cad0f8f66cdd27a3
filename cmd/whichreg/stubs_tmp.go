package main

import "github.com/spf13/cobra"

func newEvidenceCmd(app *App) *cobra.Command      { return &cobra.Command{Use: "evidence", Hidden: true} }
func newInferCmd(app *App, _ any) *cobra.Command  { return &cobra.Command{Use: "infer", Hidden: true} }
func newSwapCmd(app *App, _ any) *cobra.Command   { return &cobra.Command{Use: "swap", Hidden: true} }
func newRecordCmd(app *App, _ any) *cobra.Command { return &cobra.Command{Use: "record", Hidden: true} }
