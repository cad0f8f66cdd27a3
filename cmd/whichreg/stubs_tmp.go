package main

import "github.com/spf13/cobra"

func newSwapCmd(app *App, _ any) *cobra.Command   { return &cobra.Command{Use: "swap", Hidden: true} }
func newRecordCmd(app *App, _ any) *cobra.Command { return &cobra.Command{Use: "record", Hidden: true} }
